import bcrypt from 'bcryptjs';
import type { CreateUserRequest, UpdateUserRequest, User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { deleteUserTokens } from '../db/apiTokenRepository';
import { findUserByEmail, findUserById, insertUser, listUsers, updateUser } from '../db/userRepository';
import { AppError, notFound } from '../errors';
import { endAllSessions } from './sessionService';

const publicUser = (u: User & { active?: boolean }): User => ({ id: u.id, email: u.email, name: u.name, role: u.role, active: u.active });

export async function allUsers(ctx: AppContext): Promise<User[]> {
  return (await listUsers(ctx.db)).map(publicUser);
}

export async function createUser(ctx: AppContext, req: CreateUserRequest): Promise<User> {
  if (await findUserByEmail(ctx.db, req.email)) throw new AppError(409, 'email_taken', 'A user with that e-mail already exists');
  const passwordHash = await bcrypt.hash(req.password, ctx.config.BCRYPT_COST);
  const id = await insertUser(ctx.db, { email: req.email, name: req.name, role: req.role, passwordHash });
  return { id, email: req.email, name: req.name, role: req.role, active: true };
}

export async function changeUser(ctx: AppContext, actorId: number, id: number, req: UpdateUserRequest): Promise<User> {
  const user = await findUserById(ctx.db, id);
  if (!user) throw notFound('User');
  if (id === actorId && (req.active === false || (req.role && req.role !== 'admin'))) {
    throw new AppError(400, 'self_lockout', 'You cannot deactivate yourself or give up your own admin role');
  }
  await updateUser(ctx.db, id, req);
  // Refused on every request anyway while inactive; ending the sessions and tokens means reactivating
  // does not revive them.
  if (req.active === false) {
    await endAllSessions(ctx, id);
    await deleteUserTokens(ctx.db, id);
  }
  return publicUser({ ...user, ...req });
}

/** An admin signs a user out everywhere, e.g. after a lost laptop. */
export async function signOutEverywhere(ctx: AppContext, id: number): Promise<void> {
  if (!(await findUserById(ctx.db, id))) throw notFound('User');
  await endAllSessions(ctx, id);
}

/** Makes sure the bootstrap admin named by ADMIN_EMAIL/ADMIN_PASSWORD exists and can sign in. */
export async function ensureBootstrapAdmin(ctx: AppContext): Promise<void> {
  const { ADMIN_EMAIL: email, ADMIN_PASSWORD: password, ADMIN_NAME: name } = ctx.config;
  if (!email || !password) return;
  const existing = await findUserByEmail(ctx.db, email);
  if (!existing) {
    await insertUser(ctx.db, { email, name, role: 'admin', passwordHash: await bcrypt.hash(password, ctx.config.BCRYPT_COST) });
    return;
  }
  const patch: Parameters<typeof updateUser>[2] = {};
  if (existing.role !== 'admin') patch.role = 'admin';
  if (!existing.active) patch.active = true;
  if (!(await bcrypt.compare(password, existing.passwordHash))) patch.passwordHash = await bcrypt.hash(password, ctx.config.BCRYPT_COST);
  if (Object.keys(patch).length) await updateUser(ctx.db, existing.id, patch);
}
