import { Router } from 'express';
import { SaveComparisonRequest } from '../../shared/schemas/comparison';
import { IdParam } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { allow, currentUser } from '../middleware/auth';
import { getComparison, listComparisons, saveComparison } from '../services/comparisonService';

/** Routes under /comparisons/:id pass projectScopes first: one that includes a hidden capture answers 404. */
export function comparisonRoutes(ctx: AppContext): Router {
  return Router()
    .get('/comparisons', async (req, res) => {
      res.json({ items: await listComparisons(ctx, currentUser(req)) });
    })
    .get('/comparisons/:id', async (req, res) => {
      res.json(await getComparison(ctx, IdParam.parse(req.params).id));
    })
    .post('/comparisons', allow('admin', 'engineer'), async (req, res) => {
      res.status(201).json(await saveComparison(ctx, currentUser(req), SaveComparisonRequest.parse(req.body)));
    });
}
