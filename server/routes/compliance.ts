import { Router } from 'express';
import { ComplianceRequest } from '../../shared/schemas/compliance';
import { IdParam } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { allow, currentUser } from '../middleware/auth';
import { runCompliance } from '../services/complianceService';
import { keepCheck, listKeptChecks, removeCheck } from '../services/limitCheckService';

/**
 * Harmonic limit checks. Running one is a read, open to every role (viewers included); keeping one with
 * the capture, so that its report lists it, is a write for engineers and admins.
 */
export function complianceRoutes(ctx: AppContext): Router {
  return Router()
    .post('/captures/:id/compliance', async (req, res) => {
      res.json(await runCompliance(ctx, IdParam.parse(req.params).id, ComplianceRequest.parse(req.body)));
    })
    .get('/captures/:id/limit-checks', async (req, res) => {
      res.json({ items: await listKeptChecks(ctx, IdParam.parse(req.params).id) });
    })
    .post('/captures/:id/limit-checks', allow('admin', 'engineer'), async (req, res) => {
      const { check, created } = await keepCheck(ctx, currentUser(req), IdParam.parse(req.params).id, ComplianceRequest.parse(req.body));
      res.status(created ? 201 : 200).json(check);
    })
    .delete('/limit-checks/:id', allow('admin', 'engineer'), async (req, res) => {
      await removeCheck(ctx, currentUser(req), IdParam.parse(req.params).id);
      res.status(204).end();
    });
}
