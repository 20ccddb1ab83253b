import { Router } from 'express';
import { CreateAnnotationRequest, CreateCommentRequest, UpdateAnnotationRequest } from '../../shared/schemas/annotation';
import { IdParam } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { allow, currentUser } from '../middleware/auth';
import { addComment, createAnnotation, deleteAnnotation, listAnnotations, listComments, updateAnnotation } from '../services/annotationService';

export function annotationRoutes(ctx: AppContext): Router {
  return Router()
    .get('/captures/:id/annotations', async (req, res) => {
      res.json({ items: await listAnnotations(ctx, IdParam.parse(req.params).id) });
    })
    .post('/captures/:id/annotations', allow('admin', 'engineer'), async (req, res) => {
      res.status(201).json(await createAnnotation(ctx, currentUser(req), IdParam.parse(req.params).id, CreateAnnotationRequest.parse(req.body)));
    })
    .patch('/annotations/:id', allow('admin', 'engineer'), async (req, res) => {
      res.json(await updateAnnotation(ctx, currentUser(req), IdParam.parse(req.params).id, UpdateAnnotationRequest.parse(req.body)));
    })
    .delete('/annotations/:id', allow('admin', 'engineer'), async (req, res) => {
      await deleteAnnotation(ctx, currentUser(req), IdParam.parse(req.params).id);
      res.status(204).end();
    })
    .get('/captures/:id/comments', async (req, res) => {
      res.json({ items: await listComments(ctx, IdParam.parse(req.params).id) });
    })
    // Viewers read and comment: commenting is open to every role.
    .post('/captures/:id/comments', allow('admin', 'engineer', 'viewer'), async (req, res) => {
      res.status(201).json(await addComment(ctx, currentUser(req), IdParam.parse(req.params).id, CreateCommentRequest.parse(req.body).body));
    });
}
