import bcrypt from 'bcryptjs';
import { randomBytes } from 'node:crypto';
import { and, eq, gt, isNull, sql } from 'drizzle-orm';
import type { InviteUserRequest, SetPasswordRequest, User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { oneTimeTokens, users } from '../db/schema';
import { revokeUserSessions } from '../db/sessionRepository';
import { findUserByEmail, findUserById, insertUser } from '../db/userRepository';
import { AppError } from '../errors';
import { inviteMail, resetMail } from '../mail/messages';
import { clearAccountThrottle } from './loginThrottle';
import { hashSecretToken, newSecretToken } from './secretTokens';

const INVITE_HOURS = 7 * 24;
const RESET_HOURS = 1;

async function issueLink(ctx: AppContext, userId: number, purpose: 'invite' | 'reset', hours: number) {
  const { token, hash } = newSecretToken();
  const expiresAt = new Date(Date.now() + hours * 3600 * 1000);
  await ctx.db.insert(oneTimeTokens).values({ tokenHash: hash, purpose, userId, expiresAt });
  return { url: `${ctx.publicUrl}/set-password?token=${token}`, expiresAt };
}

/** Creates the account with a password nobody knows, and mails a one-time link to choose one. */
export async function inviteUser(ctx: AppContext, admin: User, req: InviteUserRequest): Promise<User> {
  if (await findUserByEmail(ctx.db, req.email)) throw new AppError(409, 'email_taken', 'A user with that e-mail already exists');
  const unusable = await bcrypt.hash(randomBytes(32).toString('hex'), 4);
  const id = await insertUser(ctx.db, { ...req, passwordHash: unusable });
  const link = await issueLink(ctx, id, 'invite', INVITE_HOURS);
  await ctx.mailer.send(inviteMail(req.email, admin.name, link.url, link.expiresAt));
  return { id, email: req.email, name: req.name, role: req.role, active: true };
}

/** Mails a reset link when the address belongs to an active account; says nothing either way. */
export async function requestPasswordReset(ctx: AppContext, email: string): Promise<void> {
  const user = await findUserByEmail(ctx.db, email);
  if (!user || !user.active) return;
  const link = await issueLink(ctx, user.id, 'reset', RESET_HOURS);
  await ctx.mailer.send(resetMail(user.email, link.url, link.expiresAt));
}

/**
 * Uses a one-time link: it must be unused and unexpired, and it is spent in the same transaction that
 * sets the password and ends every session of the account (whoever made the reset necessary may hold
 * one). The owner's failed sign-ins are forgotten.
 */
export async function setPasswordWithLink(ctx: AppContext, req: SetPasswordRequest): Promise<void> {
  const hash = hashSecretToken(req.token);
  const passwordHash = await bcrypt.hash(req.password, ctx.config.BCRYPT_COST);
  const userId = await ctx.db.transaction(async (tx) => {
    const [row] = await tx
      .select({ id: oneTimeTokens.id, userId: oneTimeTokens.userId })
      .from(oneTimeTokens)
      .where(and(eq(oneTimeTokens.tokenHash, hash), isNull(oneTimeTokens.usedAt), gt(oneTimeTokens.expiresAt, sql`NOW()`)))
      .for('update');
    if (!row) throw new AppError(400, 'link_invalid', 'This link has been used already or has expired; ask for a new one');
    await tx.update(oneTimeTokens).set({ usedAt: sql`NOW()` }).where(eq(oneTimeTokens.id, row.id));
    await tx.update(users).set({ passwordHash }).where(eq(users.id, row.userId));
    await revokeUserSessions(tx, row.userId);
    return row.userId;
  });
  const user = await findUserById(ctx.db, userId);
  if (user) await clearAccountThrottle(ctx, user.email);
}
