import type { ComplianceRequest, StoredLimitCheck } from '../../shared/schemas/compliance';
import type { User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { countLimitChecks, deleteLimitCheck, findLimitCheck, insertLimitCheck, listLimitChecks, type LimitCheckRow } from '../db/limitCheckRepository';
import { AppError, forbidden, notFound } from '../errors';
import { evaluateCompliance } from './complianceService';
import { readyCapture, type ReadyCapture } from './readyCapture';

/** Checks kept per capture: enough for every standard and channel a report needs, few enough to read. */
export const MAX_KEPT_CHECKS = 20;

const sameRequest = (a: ComplianceRequest, b: ComplianceRequest) => JSON.stringify(Object.entries(a).sort()) === JSON.stringify(Object.entries(b).sort());

async function withResult(ctx: AppContext, capture: ReadyCapture, row: LimitCheckRow): Promise<StoredLimitCheck> {
  return { ...row, createdAt: row.createdAt.toISOString(), result: await evaluateCompliance(ctx, capture, row.request) };
}

/** The checks kept with a ready capture, each with its result computed from the current analysis. */
export async function keptChecks(ctx: AppContext, capture: ReadyCapture): Promise<StoredLimitCheck[]> {
  const rows = await listLimitChecks(ctx.db, capture.detail.id);
  const out: StoredLimitCheck[] = [];
  for (const r of rows) out.push(await withResult(ctx, capture, r));
  return out;
}

export async function listKeptChecks(ctx: AppContext, captureId: number): Promise<StoredLimitCheck[]> {
  return keptChecks(ctx, await readyCapture(ctx, captureId));
}

/**
 * Keeps a check with its capture (a write: engineers and admins), so reports list it. The same request
 * kept twice is one check; `created` tells whether this call added it.
 */
export async function keepCheck(ctx: AppContext, user: User, captureId: number, req: ComplianceRequest): Promise<{ check: StoredLimitCheck; created: boolean }> {
  const capture = await readyCapture(ctx, captureId);
  // Evaluate first: a request naming a channel the capture lacks is refused before anything is kept.
  await evaluateCompliance(ctx, capture, req);
  const existing = (await listLimitChecks(ctx.db, captureId)).find((r) => sameRequest(r.request, req));
  if (existing) return { check: await withResult(ctx, capture, existing), created: false };
  if ((await countLimitChecks(ctx.db, captureId)) >= MAX_KEPT_CHECKS) {
    throw new AppError(409, 'too_many_checks', `A capture keeps at most ${MAX_KEPT_CHECKS} limit checks; remove one first`);
  }
  const id = await insertLimitCheck(ctx.db, captureId, req, user.id);
  return { check: await withResult(ctx, capture, (await findLimitCheck(ctx.db, id))!), created: true };
}

/** Removes a kept check: whoever kept it, or an admin. */
export async function removeCheck(ctx: AppContext, user: User, id: number): Promise<void> {
  const row = await findLimitCheck(ctx.db, id);
  if (!row) throw notFound('Limit check');
  if (user.role !== 'admin' && row.createdBy?.id !== user.id) throw forbidden('Only whoever kept this check or an admin may remove it');
  await deleteLimitCheck(ctx.db, id);
}
