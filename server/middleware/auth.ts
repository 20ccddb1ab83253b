import type { RequestHandler } from 'express';
import type { Role, User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { findUserById } from '../db/userRepository';
import { AppError, forbidden } from '../errors';
import { SESSION_COOKIE, verifySession } from '../services/sessionTokens';

declare module 'express-serve-static-core' {
  interface Request {
    user?: User;
  }
}

const noSession = () => new AppError(401, 'unauthenticated', 'Sign in to continue');

/**
 * Resolves the session cookie to a user on every request. The user is read from the database each
 * time, so a deactivation or role change takes effect at once, not when the token expires.
 */
export function requireSession(ctx: AppContext): RequestHandler {
  return async (req, _res, next) => {
    const token = req.cookies?.[SESSION_COOKIE];
    const userId = typeof token === 'string' ? await verifySession(ctx.sessionKey, token) : null;
    const user = userId ? await findUserById(ctx.db, userId) : null;
    if (!user || !user.active) return next(noSession());
    req.user = { id: user.id, email: user.email, name: user.name, role: user.role };
    next();
  };
}

/** The one place roles are enforced: mount it on a route with the roles that may use it. */
export function allow(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(noSession());
    if (!roles.includes(req.user.role)) return next(forbidden());
    next();
  };
}

/** The signed-in user; only for handlers behind requireSession. */
export function currentUser(req: { user?: User }): User {
  if (!req.user) throw noSession();
  return req.user;
}
