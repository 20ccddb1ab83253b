import type { Role, User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { annotationCaptureId, captureScope, comparisonScopes, projectScope, shareTarget } from '../db/visibilityRepository';
import { forbidden, notFound } from '../errors';
import { roleInProject, roleInProjects } from './projectRole';

/*
 * The one rule of who sees what, for anything reached by its id. Each visibleX answers the asking
 * user's role there (their own role, narrowed by a member role in a members-only project), or throws
 * 404 with the same message whether the thing does not exist or is hidden, so a guessed id tells
 * nothing. Lists use the SQL conditions of db/visibilityRepository (projectVisibleTo, comparisonVisibleTo).
 */

const orNotFound = (role: Role | null, what: string): Role => {
  if (!role) throw notFound(what);
  return role;
};

async function captureRole(ctx: AppContext, user: User, captureId: number): Promise<Role | null> {
  const scope = await captureScope(ctx.db, user.id, captureId);
  return scope && roleInProject(user, scope);
}

/** The lowest role among the projects of the comparison's captures; null if any of them is hidden. */
async function comparisonRole(ctx: AppContext, user: User, comparisonId: number): Promise<Role | null> {
  const scopes = await comparisonScopes(ctx.db, user.id, comparisonId);
  return scopes && roleInProjects(user, scopes);
}

export async function visibleProject(ctx: AppContext, user: User, projectId: number): Promise<Role> {
  const scope = await projectScope(ctx.db, user.id, projectId);
  return orNotFound(scope && roleInProject(user, scope), 'Project');
}

export const visibleCapture = async (ctx: AppContext, user: User, captureId: number): Promise<Role> => orNotFound(await captureRole(ctx, user, captureId), 'Capture');

/** A saved comparison is visible when every one of its captures is. */
export const visibleComparison = async (ctx: AppContext, user: User, comparisonId: number): Promise<Role> =>
  orNotFound(await comparisonRole(ctx, user, comparisonId), 'Comparison');

export async function visibleAnnotation(ctx: AppContext, user: User, annotationId: number): Promise<Role> {
  const captureId = await annotationCaptureId(ctx.db, annotationId);
  return orNotFound(captureId === null ? null : await captureRole(ctx, user, captureId), 'Annotation');
}

/** A share link is seen, and managed, where its capture or comparison can be seen. */
export async function visibleShare(ctx: AppContext, user: User, shareId: number): Promise<Role> {
  const target = await shareTarget(ctx.db, shareId);
  let role: Role | null = null;
  if (target?.captureId) role = await captureRole(ctx, user, target.captureId);
  else if (target?.comparisonId) role = await comparisonRole(ctx, user, target.comparisonId);
  return orNotFound(role, 'Share');
}

/** For a project named in a request body (an upload's projectId): 403 unless the role there is one of `roles`. */
export function requireRoleIn(role: Role, ...roles: Role[]): void {
  if (!roles.includes(role)) throw forbidden('Your role in this project does not allow this');
}
