import bcrypt from 'bcryptjs';
import type { ChangePasswordRequest, LoginRequest, User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { findUserByEmail, findUserById, updateUser } from '../db/userRepository';
import { AppError } from '../errors';
import { admitSignIn, signInSucceeded } from './loginThrottle';
import { endOtherSessions, startSession } from './sessionService';

/** Compared against when the e-mail is unknown, so timing does not tell whether an account exists. */
const DUMMY_HASH = bcrypt.hashSync('crestline-dummy-password', 10);

const badCredentials = () => new AppError(401, 'bad_credentials', 'The e-mail or password is not right');

/** Checks a sign-in; the error is the same whether the e-mail is unknown, the password wrong or the account off. */
export async function authenticate(ctx: AppContext, req: LoginRequest): Promise<User> {
  const user = await findUserByEmail(ctx.db, req.email);
  const ok = await bcrypt.compare(req.password, user?.passwordHash ?? DUMMY_HASH);
  if (!user || !ok || !user.active) throw badCredentials();
  return { id: user.id, email: user.email, name: user.name, role: user.role };
}

/**
 * A sign-in from a client: admitted by the failure limits (429 otherwise), checked, and on success a
 * new server-side session whose token goes into the cookie.
 */
export async function signIn(ctx: AppContext, req: LoginRequest, client: { address: string; userAgent?: string }): Promise<{ user: User; token: string }> {
  await admitSignIn(ctx, client.address, req.email);
  const user = await authenticate(ctx, req);
  await signInSucceeded(ctx, client.address, req.email);
  return { user, token: await startSession(ctx, user.id, client.userAgent) };
}

/** A new password; every other session of the user ends, the one that changed it stays. */
export async function changePassword(ctx: AppContext, userId: number, sessionId: number, req: ChangePasswordRequest): Promise<void> {
  const user = await findUserById(ctx.db, userId);
  if (!user || !(await bcrypt.compare(req.currentPassword, user.passwordHash))) {
    throw new AppError(400, 'wrong_password', 'The current password is not right');
  }
  await updateUser(ctx.db, userId, { passwordHash: await bcrypt.hash(req.newPassword, ctx.config.BCRYPT_COST) });
  await endOtherSessions(ctx, userId, sessionId);
}
