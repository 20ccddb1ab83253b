import { Router } from 'express';
import { CreateApiTokenRequest } from '../../shared/schemas/apiToken';
import { IdParam } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { allow, currentUser, sessionOnly } from '../middleware/auth';
import { allApiTokens, createApiToken, ownApiTokens, revokeApiToken } from '../services/apiTokenService';

/** Everyone manages their own API tokens, admins everyone's; only from a signed-in browser session, never with a token. */
export function apiTokenRoutes(ctx: AppContext): Router {
  return Router()
    .use(['/tokens', '/admin/tokens'], sessionOnly())
    .post('/tokens', async (req, res) => {
      res.status(201).json(await createApiToken(ctx, currentUser(req), CreateApiTokenRequest.parse(req.body)));
    })
    .get('/tokens', async (req, res) => {
      res.json({ items: await ownApiTokens(ctx, currentUser(req).id) });
    })
    .delete('/tokens/:id', async (req, res) => {
      await revokeApiToken(ctx, currentUser(req), IdParam.parse(req.params).id);
      res.status(204).end();
    })
    .get('/admin/tokens', allow('admin'), async (_req, res) => {
      res.json({ items: await allApiTokens(ctx) });
    });
}
