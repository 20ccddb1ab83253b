import type { MemberRole } from '../../shared/schemas/projectMember';
import type { ProjectVisibility } from '../../shared/schemas/project';
import type { Role, User } from '../../shared/schemas/user';

/** What decides who sees a project: its visibility, its creator, and the asking user's member role in it. */
export interface ProjectScope {
  visibility: ProjectVisibility;
  createdBy: number | null;
  /** The asking user's role as a member, or null when they are not one. */
  memberRole: MemberRole | null;
}

const RANK: Record<Role, number> = { viewer: 0, engineer: 1, admin: 2 };

/** The lesser of two roles. */
export const lowerRole = (a: Role, b: Role): Role => (RANK[a] <= RANK[b] ? a : b);

/**
 * The role `user` has in a project, or null when the project is hidden from them.
 * - Admins see everything, as admins.
 * - A 'team' project: everyone, with their own role (the behaviour before members-only projects).
 * - A 'members' project: its creator with their own role; a member with their own role narrowed by
 *   the member role (a member role never lifts anyone above their own role); nobody else.
 */
export function roleInProject(user: Pick<User, 'id' | 'role'>, scope: ProjectScope): Role | null {
  if (user.role === 'admin' || scope.visibility === 'team' || scope.createdBy === user.id) return user.role;
  return scope.memberRole ? lowerRole(user.role, scope.memberRole) : null;
}

/** The role in several projects at once (a comparison spans them): the lowest, or null if any is hidden. */
export function roleInProjects(user: Pick<User, 'id' | 'role'>, scopes: ProjectScope[]): Role | null {
  let role: Role | null = user.role;
  for (const s of scopes) {
    const r = roleInProject(user, s);
    if (r === null) return null;
    role = lowerRole(role, r);
  }
  return role;
}
