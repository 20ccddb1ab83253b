import type { AddMemberRequest, MemberCandidate, ProjectMember } from '../../shared/schemas/projectMember';
import type { User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { deleteMember, listCandidates, listMembers, upsertMember } from '../db/projectMemberRepository';
import { findUserById } from '../db/userRepository';
import { AppError, forbidden, notFound } from '../errors';
import { getProject, mayManage } from './projectService';

/** The project, when `user` may manage its members: its creator or an admin (403 for anyone else who sees it). */
async function managedProject(ctx: AppContext, user: User, projectId: number) {
  const project = await getProject(ctx, user, projectId);
  if (!mayManage(user, project)) throw forbidden('Only whoever created this project or an admin may change who is in it');
  return project;
}

/** Who is in the project, for everyone who can see it. */
export async function projectMembers(ctx: AppContext, projectId: number): Promise<ProjectMember[]> {
  return (await listMembers(ctx.db, projectId)).map((m) => ({ ...m, addedAt: m.addedAt.toISOString() }));
}

export async function memberCandidates(ctx: AppContext, user: User, projectId: number): Promise<MemberCandidate[]> {
  const project = await managedProject(ctx, user, projectId);
  return listCandidates(ctx.db, projectId, project.createdBy);
}

/**
 * Adds someone to the project, or changes their role in it. Admins and the creator always see the
 * project, so they are not added; a Crestline viewer can only be a viewer here, since a member role
 * never lifts anyone above their own role.
 */
export async function addMember(ctx: AppContext, user: User, projectId: number, req: AddMemberRequest): Promise<{ member: ProjectMember; created: boolean }> {
  const project = await managedProject(ctx, user, projectId);
  const person = await findUserById(ctx.db, req.userId);
  if (!person || !person.active) throw new AppError(400, 'unknown_user', 'There is no active user with that id');
  if (person.role === 'admin' || person.id === project.createdBy) {
    throw new AppError(400, 'always_sees', `${person.name} sees this project anyway, as ${person.role === 'admin' ? 'an admin' : 'its creator'}`);
  }
  if (person.role === 'viewer' && req.role === 'engineer') {
    throw new AppError(400, 'role_above_user', `${person.name} is a viewer in Crestline, so can only be a viewer in this project`);
  }
  const existed = await upsertMember(ctx.db, { projectId, userId: person.id, role: req.role, addedBy: user.id });
  const member = (await projectMembers(ctx, projectId)).find((m) => m.userId === person.id) as ProjectMember;
  return { member, created: !existed };
}

export async function removeMember(ctx: AppContext, user: User, projectId: number, userId: number): Promise<void> {
  await managedProject(ctx, user, projectId);
  if (!(await deleteMember(ctx.db, projectId, userId))) throw notFound('Member');
}
