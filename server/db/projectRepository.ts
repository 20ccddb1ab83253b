import { and, count, eq, sql } from 'drizzle-orm';
import type { Project, ProjectVisibility } from '../../shared/schemas/project';
import type { MemberRole } from '../../shared/schemas/projectMember';
import type { User } from '../../shared/schemas/user';
import type { Db } from './client';
import { captures, projectMembers, projects } from './schema';
import { projectVisibleTo } from './visibilityRepository';

/** A project as stored, with the asking user's member role in it (null without one); the service adds yourRole. */
export type ProjectRow = Omit<Project, 'yourRole'> & { memberRole: MemberRole | null };

const columns = (askerId: number) => ({
  id: projects.id,
  name: projects.name,
  description: projects.description,
  archived: projects.archived,
  visibility: projects.visibility,
  declaredVoltage: projects.declaredVoltage,
  createdBy: projects.createdBy,
  createdAt: projects.createdAt,
  captureCount: count(captures.id),
  memberRole: sql<MemberRole | null>`(SELECT pm.role FROM ${projectMembers} pm WHERE pm.project_id = ${projects.id} AND pm.user_id = ${askerId})`,
});

type Row = { [K in keyof ReturnType<typeof columns>]: unknown } & { createdAt: Date; captureCount: number };
const toRow = (r: Row): ProjectRow => ({
  id: r.id as number,
  name: r.name as string,
  description: r.description as string,
  archived: Boolean(r.archived),
  visibility: r.visibility as ProjectVisibility,
  declaredVoltage: (r.declaredVoltage as number | null) ?? null,
  createdBy: (r.createdBy as number | null) ?? null,
  createdAt: r.createdAt.toISOString(),
  captureCount: Number(r.captureCount),
  memberRole: (r.memberRole as MemberRole | null) ?? null,
});

/** The projects `seenBy` may see (every project when nobody is named, e.g. for the demo seed). */
export async function listProjects(db: Db, archived: 'true' | 'false' | 'all', seenBy?: User): Promise<ProjectRow[]> {
  const rows = await db
    .select(columns(seenBy?.id ?? 0))
    .from(projects)
    .leftJoin(captures, eq(captures.projectId, projects.id))
    .where(and(archived === 'all' ? undefined : eq(projects.archived, archived === 'true'), seenBy ? projectVisibleTo(seenBy, projects.id) : undefined))
    .groupBy(projects.id)
    .orderBy(projects.name);
  return rows.map(toRow);
}

/** A project by id, whoever may see it: callers check visibility (services/visibility.ts). */
export async function findProject(db: Db, id: number, askerId = 0): Promise<ProjectRow | null> {
  const [row] = await db.select(columns(askerId)).from(projects).leftJoin(captures, eq(captures.projectId, projects.id)).where(eq(projects.id, id)).groupBy(projects.id);
  return row ? toRow(row) : null;
}

export async function insertProject(db: Db, p: { name: string; description: string; createdBy: number; defaultFor?: number; visibility?: ProjectVisibility }): Promise<number> {
  const [{ id }] = await db.insert(projects).values(p).$returningId();
  return id;
}

export async function updateProject(db: Db, id: number, patch: Partial<{ name: string; description: string; archived: boolean; visibility: ProjectVisibility; declaredVoltage: number | null }>): Promise<void> {
  await db.update(projects).set(patch).where(eq(projects.id, id));
}

export async function findDefaultProjectId(db: Db, userId: number): Promise<number | null> {
  const [row] = await db.select({ id: projects.id }).from(projects).where(and(eq(projects.defaultFor, userId)));
  return row?.id ?? null;
}
