import { and, desc, eq, gt, isNull, sql } from 'drizzle-orm';
import type { SamplesQuery } from '../../shared/schemas/capture';
import { SHARED_MAX_POINTS, type CreateShareRequest, type ShareCreated, type ShareInfo, type SharedView } from '../../shared/schemas/share';
import type { User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { shares, users } from '../db/schema';
import { forbidden, notFound } from '../errors';
import { shareMail } from '../mail/messages';
import { listAnnotations } from './annotationService';
import { captureAnalysis, captureDetail } from './captureService';
import { getComparison } from './comparisonService';
import { sampleWindowData } from './sampleWindowService';
import type { SampleWindowData } from '../../shared/samples/samplesBinary';
import { hashSecretToken, newSecretToken, sameHash } from './secretTokens';

export type ShareTarget = { captureId: number } | { comparisonId: number };

const DAY_MS = 24 * 3600 * 1000;
const live = () => and(isNull(shares.revokedAt), gt(shares.expiresAt, sql`NOW()`));

/** Creates a read-only link (and mails it when an address is given). The token is shown once and kept only as a hash. */
export async function createShare(ctx: AppContext, user: User, target: ShareTarget, req: CreateShareRequest): Promise<ShareCreated> {
  const what = 'captureId' in target ? `the capture “${(await captureDetail(ctx, target.captureId)).name}”` : `the comparison “${(await getComparison(ctx, target.comparisonId)).name}”`;
  const { token, hash } = newSecretToken();
  const expiresAt = new Date(Date.now() + (req.expiresInDays ?? ctx.config.SHARE_DEFAULT_DAYS) * DAY_MS);
  const [{ id }] = await ctx.db
    .insert(shares)
    .values({ tokenHash: hash, ...target, createdBy: user.id, email: req.email ?? null, expiresAt })
    .$returningId();
  const url = `${ctx.publicUrl}/shared/${token}`;
  if (req.email) await ctx.mailer.send(shareMail(req.email, user.name, what, url, expiresAt, req.message));
  return { id, token, url, expiresAt: expiresAt.toISOString() };
}

export async function liveShares(ctx: AppContext, target: ShareTarget): Promise<ShareInfo[]> {
  const where = 'captureId' in target ? eq(shares.captureId, target.captureId) : eq(shares.comparisonId, target.comparisonId);
  const rows = await ctx.db
    .select({ id: shares.id, email: shares.email, createdBy: users.name, createdAt: shares.createdAt, expiresAt: shares.expiresAt, lastOpenedAt: shares.lastOpenedAt, openCount: shares.openCount })
    .from(shares)
    .leftJoin(users, eq(users.id, shares.createdBy))
    .where(and(where, live()))
    .orderBy(desc(shares.createdAt));
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString(), expiresAt: r.expiresAt.toISOString(), lastOpenedAt: r.lastOpenedAt?.toISOString() ?? null }));
}

/** Revokes a link at once: its creator or an admin. */
export async function revokeShare(ctx: AppContext, user: User, id: number): Promise<void> {
  const [row] = await ctx.db.select({ createdBy: shares.createdBy }).from(shares).where(eq(shares.id, id));
  if (!row) throw notFound('Share');
  if (user.role !== 'admin' && row.createdBy !== user.id) throw forbidden('Only whoever shared it or an admin may revoke this link');
  await ctx.db.update(shares).set({ revokedAt: sql`NOW()` }).where(eq(shares.id, id));
}

/**
 * The live share a token opens, counted as one more opening; 404 for a token that is unknown,
 * revoked or expired (the same answer for each, so a guess learns nothing).
 */
export async function openShare(ctx: AppContext, token: string, count = true) {
  const hash = hashSecretToken(token);
  const [row] = await ctx.db
    .select({ id: shares.id, tokenHash: shares.tokenHash, captureId: shares.captureId, comparisonId: shares.comparisonId, expiresAt: shares.expiresAt, sharedBy: users.name })
    .from(shares)
    .leftJoin(users, eq(users.id, shares.createdBy))
    .where(and(eq(shares.tokenHash, hash), live()));
  if (!row || !sameHash(row.tokenHash, hash)) throw notFound('This shared link');
  if (count) await ctx.db.update(shares).set({ lastOpenedAt: sql`NOW()`, openCount: sql`${shares.openCount} + 1` }).where(eq(shares.id, row.id));
  return row;
}

/** Everything the shared page shows, read-only. */
export async function sharedView(ctx: AppContext, token: string): Promise<SharedView> {
  const share = await openShare(ctx, token);
  const comparison = share.comparisonId ? await getComparison(ctx, share.comparisonId) : null;
  const ids = comparison ? comparison.captureIds : [share.captureId as number];
  const captures = [];
  for (const id of ids) {
    captures.push({ capture: await captureDetail(ctx, id), analysis: await captureAnalysis(ctx, id), annotations: await listAnnotations(ctx, id) });
  }
  return { kind: comparison ? 'comparison' : 'capture', sharedBy: share.sharedBy ?? 'A Crestline user', expiresAt: share.expiresAt.toISOString(), comparison, captures };
}

/** The capture ids a token may read samples of. */
export async function sharedCaptureIds(ctx: AppContext, token: string): Promise<number[]> {
  const share = await openShare(ctx, token, false);
  if (share.captureId) return [share.captureId];
  return (await getComparison(ctx, share.comparisonId as number)).captureIds;
}

/** Samples of a capture the token opens, at most SHARED_MAX_POINTS of them (a larger `points` is lowered, not refused, so the shared page keeps working). */
export async function sharedSamples(ctx: AppContext, token: string, captureId: number, q: SamplesQuery): Promise<SampleWindowData> {
  if (!(await sharedCaptureIds(ctx, token)).includes(captureId)) throw notFound('This shared capture');
  return sampleWindowData(ctx, captureId, { ...q, points: Math.min(q.points, SHARED_MAX_POINTS) });
}
