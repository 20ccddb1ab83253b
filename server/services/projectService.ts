import type { CreateProjectRequest, Project, UpdateProjectRequest } from '../../shared/schemas/project';
import type { User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { findDefaultProjectId, findProject, insertProject, listProjects, updateProject, type ProjectRow } from '../db/projectRepository';
import { forbidden, notFound } from '../errors';
import { roleInProject } from './projectRole';

/** The project as `user` sees it, or null when it is hidden from them. */
function asSeenBy(user: User, row: ProjectRow): Project | null {
  const yourRole = roleInProject(user, row);
  if (!yourRole) return null;
  const { id, name, description, archived, visibility, declaredVoltage, createdBy, createdAt, captureCount } = row;
  return { id, name, description, archived, visibility, declaredVoltage, createdBy, createdAt, captureCount, yourRole };
}

/** The projects `user` may see; members-only ones they are not in are left out without a word. */
export async function projectsFor(ctx: AppContext, user: User, archived: 'true' | 'false' | 'all'): Promise<Project[]> {
  return (await listProjects(ctx.db, archived, user)).flatMap((row) => asSeenBy(user, row) ?? []);
}

export async function getProject(ctx: AppContext, user: User, id: number): Promise<Project> {
  const row = await findProject(ctx.db, id, user.id);
  const project = row && asSeenBy(user, row);
  if (!project) throw notFound('Project');
  return project;
}

export async function createProject(ctx: AppContext, user: User, req: CreateProjectRequest): Promise<Project> {
  const id = await insertProject(ctx.db, { name: req.name, description: req.description, visibility: req.visibility, createdBy: user.id });
  return getProject(ctx, user, id);
}

/** Whoever manages a project (its settings, its members): its creator, or an admin. */
export function mayManage(user: User, project: Pick<Project, 'createdBy'>): boolean {
  return user.role === 'admin' || project.createdBy === user.id;
}

/** Renames, describes, archives, restores or restricts a project: whoever created it, or an admin. */
export async function changeProject(ctx: AppContext, user: User, id: number, req: UpdateProjectRequest): Promise<Project> {
  const project = await getProject(ctx, user, id);
  if (!mayManage(user, project)) throw forbidden('Only whoever created this project or an admin may change it');
  await updateProject(ctx.db, id, req);
  return getProject(ctx, user, id);
}

/** The project that receives a user's uploads when none is named; made on first use. */
export async function defaultProjectId(ctx: AppContext, userId: number, userName: string): Promise<number> {
  const existing = await findDefaultProjectId(ctx.db, userId);
  if (existing) return existing;
  try {
    return await insertProject(ctx.db, { name: `${userName}'s captures`, description: 'Uploads not filed under a project.', createdBy: userId, defaultFor: userId });
  } catch (err) {
    // Two uploads at once may race to create it; the unique default_for column keeps one.
    const again = await findDefaultProjectId(ctx.db, userId);
    if (again) return again;
    throw err;
  }
}
