import type { CreateProjectRequest, Project, UpdateProjectRequest } from '../../shared/schemas/project';
import type { User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { findDefaultProjectId, findProject, insertProject, listProjects, updateProject } from '../db/projectRepository';
import { forbidden, notFound } from '../errors';

export const projectsFor = (ctx: AppContext, archived: 'true' | 'false' | 'all') => listProjects(ctx.db, archived);

export async function getProject(ctx: AppContext, id: number): Promise<Project> {
  const p = await findProject(ctx.db, id);
  if (!p) throw notFound('Project');
  return p;
}

export async function createProject(ctx: AppContext, userId: number, req: CreateProjectRequest): Promise<Project> {
  const id = await insertProject(ctx.db, { name: req.name, description: req.description, createdBy: userId });
  return getProject(ctx, id);
}

/** Renames, describes, archives or restores a project: whoever created it, or an admin. */
export async function changeProject(ctx: AppContext, user: User, id: number, req: UpdateProjectRequest): Promise<Project> {
  const project = await getProject(ctx, id);
  if (user.role !== 'admin' && project.createdBy !== user.id) throw forbidden('Only whoever created this project or an admin may change it');
  await updateProject(ctx.db, id, req);
  return getProject(ctx, id);
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
