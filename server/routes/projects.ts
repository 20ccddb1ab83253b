import { Router } from 'express';
import { CreateProjectRequest, ProjectListQuery, UpdateProjectRequest } from '../../shared/schemas/project';
import { IdParam } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { addDemoCaptures } from '../db/seed';
import { allow, currentUser } from '../middleware/auth';
import { changeProject, createProject, getProject, projectsFor } from '../services/projectService';

/** Routes under /projects/:id pass projectScopes first: a project hidden from the user answers 404. */
export function projectRoutes(ctx: AppContext, onQueued: () => void): Router {
  return Router()
    .get('/projects', async (req, res) => {
      const { archived } = ProjectListQuery.parse(req.query);
      res.json({ items: await projectsFor(ctx, currentUser(req), archived) });
    })
    .get('/projects/:id', async (req, res) => {
      res.json({ project: await getProject(ctx, currentUser(req), IdParam.parse(req.params).id) });
    })
    .post('/projects', allow('admin', 'engineer'), async (req, res) => {
      res.status(201).json({ project: await createProject(ctx, currentUser(req), CreateProjectRequest.parse(req.body)) });
    })
    .post('/projects/:id/demo-captures', allow('admin', 'engineer'), async (req, res) => {
      const project = await getProject(ctx, currentUser(req), IdParam.parse(req.params).id);
      const added = await addDemoCaptures(ctx, currentUser(req), project.id);
      if (added) onQueued();
      res.status(202).json({ added });
    })
    .patch('/projects/:id', allow('admin', 'engineer'), async (req, res) => {
      res.json({ project: await changeProject(ctx, currentUser(req), IdParam.parse(req.params).id, UpdateProjectRequest.parse(req.body)) });
    });
}
