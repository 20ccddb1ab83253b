import { eq } from 'drizzle-orm';
import type { Role, User } from '../../shared/schemas/user';
import type { Db } from './client';
import { users } from './schema';

export interface UserRecord extends User {
  passwordHash: string;
  active: boolean;
}

const toRecord = (r: typeof users.$inferSelect): UserRecord => ({
  id: r.id,
  email: r.email,
  name: r.name,
  role: r.role,
  active: r.active,
  passwordHash: r.passwordHash,
});

export async function findUserByEmail(db: Db, email: string): Promise<UserRecord | null> {
  const [row] = await db.select().from(users).where(eq(users.email, email.toLowerCase()));
  return row ? toRecord(row) : null;
}

export async function findUserById(db: Db, id: number): Promise<UserRecord | null> {
  const [row] = await db.select().from(users).where(eq(users.id, id));
  return row ? toRecord(row) : null;
}

export async function listUsers(db: Db): Promise<UserRecord[]> {
  return (await db.select().from(users).orderBy(users.name)).map(toRecord);
}

export async function insertUser(db: Db, u: { email: string; name: string; role: Role; passwordHash: string }): Promise<number> {
  const [{ id }] = await db.insert(users).values({ ...u, email: u.email.toLowerCase() }).$returningId();
  return id;
}

export async function updateUser(db: Db, id: number, patch: Partial<{ role: Role; active: boolean; name: string; passwordHash: string }>): Promise<void> {
  await db.update(users).set(patch).where(eq(users.id, id));
}
