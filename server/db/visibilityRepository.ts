import { eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { User } from '../../shared/schemas/user';
import type { ProjectScope } from '../services/projectRole';
import type { DbOrTx } from './client';
import { annotations, captures, comparisons, projectMembers, projects, shares } from './schema';

/**
 * Whether the projects row named `alias` is visible to the user, in SQL: the same rule as roleInProject
 * (admins are handled by the callers, who add no condition at all). `<=>` keeps the result true or
 * false, never NULL, for projects without a creator, so the rule can be negated safely.
 */
const visibleRow = (alias: string, userId: number) =>
  sql`(${sql.raw(alias)}.visibility = 'team' OR ${sql.raw(alias)}.created_by <=> ${userId} OR EXISTS (SELECT 1 FROM ${projectMembers} vm WHERE vm.project_id = ${sql.raw(alias)}.id AND vm.user_id = ${userId}))`;

/**
 * A condition on a project id (a column of the query it goes into): true for the projects `user` may
 * see. Undefined for admins, who see everything; drizzle's and() skips it. For every list.
 */
export function projectVisibleTo(user: User, projectId: SQL | typeof captures.projectId | typeof projects.id): SQL | undefined {
  if (user.role === 'admin') return undefined;
  return sql`EXISTS (SELECT 1 FROM ${projects} vp WHERE vp.id = ${projectId} AND ${visibleRow('vp', user.id)})`;
}

/**
 * A condition on the comparisons table: true when none of the comparison's captures lies in a project
 * hidden from `user`. The search starts from members-only projects, usually few, rather than from every
 * capture. Captures deleted since the comparison was saved hide nothing.
 */
export function comparisonVisibleTo(user: User): SQL | undefined {
  if (user.role === 'admin') return undefined;
  return sql`NOT EXISTS (SELECT 1 FROM ${projects} hp JOIN ${captures} hc ON hc.project_id = hp.id
    WHERE hp.visibility = 'members' AND NOT ${visibleRow('hp', user.id)} AND JSON_CONTAINS(${comparisons.captureIds}, CAST(hc.id AS CHAR)))`;
}

const scopeColumns = (userId: number) => ({
  visibility: projects.visibility,
  createdBy: projects.createdBy,
  memberRole: sql<ProjectScope['memberRole']>`(SELECT sm.role FROM ${projectMembers} sm WHERE sm.project_id = ${projects.id} AND sm.user_id = ${userId})`,
});

export async function projectScope(db: DbOrTx, userId: number, projectId: number): Promise<ProjectScope | null> {
  const [row] = await db.select(scopeColumns(userId)).from(projects).where(eq(projects.id, projectId));
  return row ?? null;
}

export async function captureScope(db: DbOrTx, userId: number, captureId: number): Promise<ProjectScope | null> {
  const [row] = await db.select(scopeColumns(userId)).from(captures).innerJoin(projects, eq(projects.id, captures.projectId)).where(eq(captures.id, captureId));
  return row ?? null;
}

export async function annotationCaptureId(db: DbOrTx, annotationId: number): Promise<number | null> {
  const [row] = await db.select({ captureId: annotations.captureId }).from(annotations).where(eq(annotations.id, annotationId));
  return row?.captureId ?? null;
}

/** The projects of a saved comparison's captures, or null when there is no such comparison. */
export async function comparisonScopes(db: DbOrTx, userId: number, comparisonId: number): Promise<ProjectScope[] | null> {
  const [found] = await db.select({ captureIds: comparisons.captureIds }).from(comparisons).where(eq(comparisons.id, comparisonId));
  if (!found) return null;
  // mysql2 hands a JSON column back as text on MariaDB, where JSON is an alias of LONGTEXT.
  const ids = (typeof found.captureIds === 'string' ? JSON.parse(found.captureIds) : found.captureIds) as number[];
  if (ids.length === 0) return [];
  return db.select(scopeColumns(userId)).from(captures).innerJoin(projects, eq(projects.id, captures.projectId)).where(inArray(captures.id, ids));
}

export async function shareTarget(db: DbOrTx, shareId: number): Promise<{ captureId: number | null; comparisonId: number | null } | null> {
  const [row] = await db.select({ captureId: shares.captureId, comparisonId: shares.comparisonId }).from(shares).where(eq(shares.id, shareId));
  return row ?? null;
}
