import { and, desc, eq, gt, isNotNull, isNull, lt, ne, or, sql } from 'drizzle-orm';
import type { Role } from '../../shared/schemas/user';
import type { DbOrTx } from './client';
import { sessions, users } from './schema';

export interface LiveSession {
  id: number;
  userId: number;
  /** Last seen more than a minute ago: time to record this request. */
  stale: boolean;
  user: { id: number; email: string; name: string; role: Role; active: boolean };
}

const live = () => and(isNull(sessions.revokedAt), gt(sessions.expiresAt, sql`NOW()`));

export async function insertSession(db: DbOrTx, s: { userId: number; idHash: string; expiresAt: Date; userAgent: string }): Promise<number> {
  const [{ id }] = await db.insert(sessions).values(s).$returningId();
  return id;
}

/** The unrevoked, unexpired session with this id hash, with its user, in one query (it runs on every request). */
export async function findLiveSession(db: DbOrTx, idHash: string): Promise<LiveSession | null> {
  const [row] = await db
    .select({
      id: sessions.id,
      userId: sessions.userId,
      stale: sql<number>`${sessions.lastSeenAt} < NOW() - INTERVAL 60 SECOND`,
      email: users.email,
      name: users.name,
      role: users.role,
      active: users.active,
    })
    .from(sessions)
    .innerJoin(users, eq(users.id, sessions.userId))
    .where(and(eq(sessions.idHash, idHash), live()));
  if (!row) return null;
  return { id: row.id, userId: row.userId, stale: Boolean(Number(row.stale)), user: { id: row.userId, email: row.email, name: row.name, role: row.role, active: row.active } };
}

/** Records that the session was used; the condition keeps it to one write a minute even under concurrent requests. */
export async function touchSession(db: DbOrTx, id: number): Promise<void> {
  await db.update(sessions).set({ lastSeenAt: sql`NOW()` }).where(and(eq(sessions.id, id), lt(sessions.lastSeenAt, sql`NOW() - INTERVAL 60 SECOND`)));
}

export async function listLiveSessions(db: DbOrTx, userId: number) {
  return db
    .select({ id: sessions.id, createdAt: sessions.createdAt, lastSeenAt: sessions.lastSeenAt, expiresAt: sessions.expiresAt, userAgent: sessions.userAgent })
    .from(sessions)
    .where(and(eq(sessions.userId, userId), live()))
    .orderBy(desc(sessions.lastSeenAt), desc(sessions.id));
}

export async function revokeSession(db: DbOrTx, id: number): Promise<void> {
  await db.update(sessions).set({ revokedAt: sql`NOW()` }).where(and(eq(sessions.id, id), isNull(sessions.revokedAt)));
}

/** Ends every live session of a user, or every one but `exceptId` (the session asking). */
export async function revokeUserSessions(db: DbOrTx, userId: number, exceptId?: number): Promise<void> {
  const others = exceptId === undefined ? undefined : ne(sessions.id, exceptId);
  await db.update(sessions).set({ revokedAt: sql`NOW()` }).where(and(eq(sessions.userId, userId), isNull(sessions.revokedAt), others));
}

/** Forgets a user's ended sessions, so the table holds little more than the live ones. */
export async function deleteEndedSessions(db: DbOrTx, userId: number): Promise<void> {
  await db.delete(sessions).where(and(eq(sessions.userId, userId), or(isNotNull(sessions.revokedAt), lt(sessions.expiresAt, sql`NOW()`))));
}
