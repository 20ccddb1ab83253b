import { Router } from 'express';
import type { AppContext } from '../context';

export function healthRoutes(ctx: AppContext): Router {
  return Router().get('/health', async (_req, res) => {
    const ok = await ctx.pingDatabase();
    res.status(ok ? 200 : 503).json({ status: ok ? 'ok' : 'degraded', db: ok ? 'ok' : 'unreachable' });
  });
}
