import { Router } from 'express';
import { SamplesQuery } from '../../shared/schemas/capture';
import { TrendQuery } from '../../shared/schemas/powerQuality';
import { CreateShareRequest } from '../../shared/schemas/share';
import { IdParam } from '../../shared/schemas/user';
import { z } from 'zod';
import type { AppContext } from '../context';
import { sendSamples } from './sendSamples';
import { AppError, notFound } from '../errors';
import { allow, currentUser } from '../middleware/auth';
import { clientAddress, limitRequests } from '../middleware/requestLimits';
import { hashSecretToken } from '../services/secretTokens';
import { channelTrend } from '../services/trendService';
import { createShare, liveShares, revokeShare, sharedCaptureIds, sharedSamples, sharedView } from '../services/shareService';
import { sharedCaptureReport, sharedReport } from '../services/reportService';
import { sendPdf } from './sendFile';

/** Creating, listing and revoking links: signed-in engineers and admins. */
export function shareRoutes(ctx: AppContext): Router {
  return Router()
    .post('/captures/:id/shares', allow('admin', 'engineer'), async (req, res) => {
      res.status(201).json(await createShare(ctx, currentUser(req), { captureId: IdParam.parse(req.params).id }, CreateShareRequest.parse(req.body ?? {})));
    })
    .post('/comparisons/:id/shares', allow('admin', 'engineer'), async (req, res) => {
      res.status(201).json(await createShare(ctx, currentUser(req), { comparisonId: IdParam.parse(req.params).id }, CreateShareRequest.parse(req.body ?? {})));
    })
    .get('/captures/:id/shares', allow('admin', 'engineer'), async (req, res) => {
      res.json({ items: await liveShares(ctx, { captureId: IdParam.parse(req.params).id }) });
    })
    .get('/comparisons/:id/shares', allow('admin', 'engineer'), async (req, res) => {
      res.json({ items: await liveShares(ctx, { comparisonId: IdParam.parse(req.params).id }) });
    })
    .delete('/shares/:id', allow('admin', 'engineer'), async (req, res) => {
      await revokeShare(ctx, currentUser(req), IdParam.parse(req.params).id);
      res.status(204).end();
    });
}

const TokenParam = z.object({ token: z.string().min(20).max(100) });
const TokenCaptureParams = TokenParam.extend({ captureId: z.coerce.number().int().positive() });

/**
 * Reads through share links, counted per address and per link in the database's shared counters rather
 * than in memory: with several server processes behind one address, a count per process would let a
 * link be read that many times faster, and these reads are the costly ones anyone may make. The link is
 * counted by its hash, so the counters never hold a usable token.
 */
function sharedReadLimits(ctx: AppContext) {
  return limitRequests(
    ctx,
    [
      { name: 'shared-ip', key: clientAddress, limit: ctx.config.SHARE_READS_PER_ADDRESS, windowS: 60 },
      { name: 'shared-link', key: (req) => hashSecretToken(String(req.params.token)), limit: ctx.config.SHARE_READS_PER_LINK, windowS: 60 },
    ],
    { code: 'too_many_requests', message: 'This shared link is being read too often' },
  );
}

/**
 * What a share link opens, without a session: the token is the only credential, and it reads one
 * capture or comparison. Any other method is refused here, by the server, not only hidden.
 */
export function sharedRoutes(ctx: AppContext): Router {
  return Router()
    // A prefix: also counts the samples route and refused writes under the link.
    .use('/shared/:token', sharedReadLimits(ctx))
    .get('/shared/:token', async (req, res) => {
      res.set('Cache-Control', 'no-store');
      res.json(await sharedView(ctx, TokenParam.parse(req.params).token));
    })
    .get('/shared/:token/captures/:captureId/samples', async (req, res) => {
      const { token, captureId } = TokenCaptureParams.parse(req.params);
      sendSamples(req, res, await sharedSamples(ctx, token, captureId, SamplesQuery.parse(req.query)));
    })
    .get('/shared/:token/captures/:captureId/trend', async (req, res) => {
      const { token, captureId } = TokenCaptureParams.parse(req.params);
      if (!(await sharedCaptureIds(ctx, token)).includes(captureId)) throw notFound('This shared capture');
      res.json(await channelTrend(ctx, captureId, TrendQuery.parse(req.query)));
    })
    // Reports are the costliest reads a link allows: they sit behind the same limits.
    .get('/shared/:token/report.pdf', async (req, res) => {
      sendPdf(res, await sharedReport(ctx, TokenParam.parse(req.params).token));
    })
    .get('/shared/:token/captures/:captureId/report.pdf', async (req, res) => {
      const { token, captureId } = TokenCaptureParams.parse(req.params);
      sendPdf(res, await sharedCaptureReport(ctx, token, captureId));
    })
    .all(['/shared/:token', '/shared/:token/{*rest}'], () => {
      throw new AppError(405, 'read_only', 'A shared link is read-only');
    });
}
