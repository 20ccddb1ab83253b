import { and, desc, eq, inArray } from 'drizzle-orm';
import { Comparison, ComparisonSettings, type SaveComparisonRequest } from '../../shared/schemas/comparison';
import type { User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { captures, comparisons, users } from '../db/schema';
import { comparisonVisibleTo, projectVisibleTo } from '../db/visibilityRepository';
import { AppError, notFound } from '../errors';

const columns = { id: comparisons.id, name: comparisons.name, captureIds: comparisons.captureIds, settings: comparisons.settings, createdById: comparisons.createdBy, createdByName: users.name, createdAt: comparisons.createdAt };
type Row = { id: number; name: string; captureIds: unknown; settings: unknown; createdById: number | null; createdByName: string | null; createdAt: Date };
const json = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v);
const toComparison = (r: Row): Comparison =>
  Comparison.parse({
    id: r.id,
    name: r.name,
    captureIds: json(r.captureIds),
    settings: ComparisonSettings.parse(json(r.settings) ?? {}),
    createdBy: r.createdById ? { id: r.createdById, name: r.createdByName ?? '' } : null,
    createdAt: r.createdAt.toISOString(),
  });

/** Saves a comparison of captures the user can see; one they cannot is answered as one that does not exist. */
export async function saveComparison(ctx: AppContext, user: User, req: SaveComparisonRequest): Promise<Comparison> {
  const found = await ctx.db
    .select({ id: captures.id })
    .from(captures)
    .where(and(inArray(captures.id, req.captureIds), projectVisibleTo(user, captures.projectId)));
  if (found.length !== new Set(req.captureIds).size) throw new AppError(400, 'invalid_request', 'Some of those captures do not exist');
  const [{ id }] = await ctx.db.insert(comparisons).values({ name: req.name, captureIds: req.captureIds, settings: req.settings, createdBy: user.id }).$returningId();
  return getComparison(ctx, id);
}

export async function getComparison(ctx: AppContext, id: number): Promise<Comparison> {
  const [row] = await ctx.db.select(columns).from(comparisons).leftJoin(users, eq(users.id, comparisons.createdBy)).where(eq(comparisons.id, id));
  if (!row) throw notFound('Comparison');
  return toComparison(row as Row);
}

/** The latest comparisons `user` may see: one that includes any capture hidden from them is left out. */
export async function listComparisons(ctx: AppContext, user: User): Promise<Comparison[]> {
  const rows = await ctx.db
    .select(columns)
    .from(comparisons)
    .leftJoin(users, eq(users.id, comparisons.createdBy))
    .where(comparisonVisibleTo(user))
    .orderBy(desc(comparisons.createdAt))
    .limit(200);
  return rows.map((r) => toComparison(r as Row));
}
