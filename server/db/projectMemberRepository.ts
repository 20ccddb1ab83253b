import { and, asc, eq, ne, notExists, sql } from 'drizzle-orm';
import type { MemberRole } from '../../shared/schemas/projectMember';
import type { DbOrTx } from './client';
import { projectMembers, users } from './schema';

export async function listMembers(db: DbOrTx, projectId: number) {
  return db
    .select({ userId: projectMembers.userId, name: users.name, email: users.email, role: projectMembers.role, addedAt: projectMembers.addedAt })
    .from(projectMembers)
    .innerJoin(users, eq(users.id, projectMembers.userId))
    .where(eq(projectMembers.projectId, projectId))
    .orderBy(asc(users.name));
}

/** Active users who are not admins (they see every project anyway), not `creatorId`, and not members yet. */
export async function listCandidates(db: DbOrTx, projectId: number, creatorId: number | null) {
  const member = db.select({ one: sql`1` }).from(projectMembers).where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, users.id)));
  return db
    .select({ id: users.id, name: users.name, email: users.email, role: users.role })
    .from(users)
    .where(and(eq(users.active, true), ne(users.role, 'admin'), creatorId === null ? undefined : ne(users.id, creatorId), notExists(member)))
    .orderBy(asc(users.name));
}

/** Adds a member, or changes the role of one; answers whether the user was a member before. */
export async function upsertMember(db: DbOrTx, m: { projectId: number; userId: number; role: MemberRole; addedBy: number }): Promise<boolean> {
  const [before] = await db.select({ role: projectMembers.role }).from(projectMembers).where(and(eq(projectMembers.projectId, m.projectId), eq(projectMembers.userId, m.userId)));
  await db.insert(projectMembers).values(m).onDuplicateKeyUpdate({ set: { role: m.role } });
  return before !== undefined;
}

/** Answers whether there was such a member. */
export async function deleteMember(db: DbOrTx, projectId: number, userId: number): Promise<boolean> {
  const [result] = await db.delete(projectMembers).where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, userId)));
  return result.affectedRows > 0;
}
