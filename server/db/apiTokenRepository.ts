import { and, count, desc, eq, gt, lt, lte, sql } from 'drizzle-orm';
import type { Role } from '../../shared/schemas/user';
import type { DbOrTx } from './client';
import { apiTokens, users } from './schema';

export interface LiveToken {
  id: number;
  tokenHash: string;
  readOnly: boolean;
  /** Last used more than a minute ago: time to record this request. */
  stale: boolean;
  user: { id: number; email: string; name: string; role: Role; active: boolean };
}

const unexpired = () => gt(apiTokens.expiresAt, sql`NOW()`);

export async function insertToken(db: DbOrTx, t: { userId: number; name: string; tokenHash: string; hint: string; readOnly: boolean; expiresAt: Date }): Promise<number> {
  const [{ id }] = await db.insert(apiTokens).values(t).$returningId();
  return id;
}

export async function countLiveTokens(db: DbOrTx, userId: number): Promise<number> {
  const [row] = await db.select({ n: count() }).from(apiTokens).where(and(eq(apiTokens.userId, userId), unexpired()));
  return Number(row.n);
}

/** Forgets a user's expired tokens; they can never work again. */
export async function deleteExpiredTokens(db: DbOrTx, userId: number): Promise<void> {
  await db.delete(apiTokens).where(and(eq(apiTokens.userId, userId), lte(apiTokens.expiresAt, sql`NOW()`)));
}

/** One user's tokens, or (without a user) everyone's, newest first, with their owners. */
export async function listTokens(db: DbOrTx, userId?: number) {
  return db
    .select({
      id: apiTokens.id,
      name: apiTokens.name,
      hint: apiTokens.hint,
      readOnly: apiTokens.readOnly,
      createdAt: apiTokens.createdAt,
      lastUsedAt: apiTokens.lastUsedAt,
      expiresAt: apiTokens.expiresAt,
      ownerId: users.id,
      ownerName: users.name,
      ownerEmail: users.email,
    })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(userId === undefined ? undefined : eq(apiTokens.userId, userId))
    .orderBy(desc(apiTokens.createdAt), desc(apiTokens.id));
}

export async function findTokenOwner(db: DbOrTx, id: number): Promise<number | null> {
  const [row] = await db.select({ userId: apiTokens.userId }).from(apiTokens).where(eq(apiTokens.id, id));
  return row?.userId ?? null;
}

export async function deleteToken(db: DbOrTx, id: number): Promise<void> {
  await db.delete(apiTokens).where(eq(apiTokens.id, id));
}

export async function deleteUserTokens(db: DbOrTx, userId: number): Promise<void> {
  await db.delete(apiTokens).where(eq(apiTokens.userId, userId));
}

/** The unexpired token with this hash, with its owner, in one query (it runs on every token request). */
export async function findLiveToken(db: DbOrTx, tokenHash: string): Promise<LiveToken | null> {
  const [row] = await db
    .select({
      id: apiTokens.id,
      tokenHash: apiTokens.tokenHash,
      readOnly: apiTokens.readOnly,
      stale: sql<number>`${apiTokens.lastUsedAt} IS NULL OR ${apiTokens.lastUsedAt} < NOW() - INTERVAL 60 SECOND`,
      userId: users.id,
      email: users.email,
      name: users.name,
      role: users.role,
      active: users.active,
    })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, tokenHash), unexpired()));
  if (!row) return null;
  const { userId, email, name, role, active } = row;
  return { id: row.id, tokenHash: row.tokenHash, readOnly: row.readOnly, stale: Boolean(Number(row.stale)), user: { id: userId, email, name, role, active } };
}

/** Records that the token was used; the condition keeps it to one write a minute even under concurrent requests. */
export async function touchToken(db: DbOrTx, id: number): Promise<void> {
  await db
    .update(apiTokens)
    .set({ lastUsedAt: sql`NOW()` })
    .where(and(eq(apiTokens.id, id), sql`(${apiTokens.lastUsedAt} IS NULL OR ${lt(apiTokens.lastUsedAt, sql`NOW() - INTERVAL 60 SECOND`)})`));
}
