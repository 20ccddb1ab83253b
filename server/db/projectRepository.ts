import { and, count, eq, sql } from 'drizzle-orm';
import type { Project } from '../../shared/schemas/project';
import type { Db } from './client';
import { captures, projects } from './schema';

const columns = {
  id: projects.id,
  name: projects.name,
  description: projects.description,
  archived: projects.archived,
  declaredVoltage: projects.declaredVoltage,
  createdBy: projects.createdBy,
  createdAt: projects.createdAt,
  captureCount: count(captures.id),
};

type Row = { [K in keyof typeof columns]: unknown } & { createdAt: Date; captureCount: number };
const toProject = (r: Row): Project => ({
  id: r.id as number,
  name: r.name as string,
  description: r.description as string,
  archived: Boolean(r.archived),
  declaredVoltage: (r.declaredVoltage as number | null) ?? null,
  createdBy: (r.createdBy as number | null) ?? null,
  createdAt: r.createdAt.toISOString(),
  captureCount: Number(r.captureCount),
});

export async function listProjects(db: Db, archived: 'true' | 'false' | 'all'): Promise<Project[]> {
  const rows = await db
    .select(columns)
    .from(projects)
    .leftJoin(captures, eq(captures.projectId, projects.id))
    .where(archived === 'all' ? sql`1=1` : eq(projects.archived, archived === 'true'))
    .groupBy(projects.id)
    .orderBy(projects.name);
  return rows.map(toProject);
}

export async function findProject(db: Db, id: number): Promise<Project | null> {
  const [row] = await db.select(columns).from(projects).leftJoin(captures, eq(captures.projectId, projects.id)).where(eq(projects.id, id)).groupBy(projects.id);
  return row ? toProject(row) : null;
}

export async function insertProject(db: Db, p: { name: string; description: string; createdBy: number; defaultFor?: number }): Promise<number> {
  const [{ id }] = await db.insert(projects).values(p).$returningId();
  return id;
}

export async function updateProject(db: Db, id: number, patch: Partial<{ name: string; description: string; archived: boolean; declaredVoltage: number | null }>): Promise<void> {
  await db.update(projects).set(patch).where(eq(projects.id, id));
}

export async function findDefaultProjectId(db: Db, userId: number): Promise<number | null> {
  const [row] = await db.select({ id: projects.id }).from(projects).where(and(eq(projects.defaultFor, userId)));
  return row?.id ?? null;
}
