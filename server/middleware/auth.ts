import type { RequestHandler } from 'express';
import type { Role, User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { AppError, forbidden } from '../errors';
import { resolveSession } from '../services/sessionService';
import { SESSION_COOKIE } from '../services/sessionTokens';

declare module 'express-serve-static-core' {
  interface Request {
    user?: User;
    /** The sessions row behind the cookie, for sign-out and "sign out other sessions". */
    sessionId?: number;
  }
}

const noSession = () => new AppError(401, 'unauthenticated', 'Sign in to continue');

/**
 * Resolves the session cookie to a user on every request. The session and the user are read from the
 * database each time, so a sign-out elsewhere, a deactivation or a role change takes effect at once,
 * not when the token expires.
 */
export function requireSession(ctx: AppContext): RequestHandler {
  return async (req, _res, next) => {
    const token = req.cookies?.[SESSION_COOKIE];
    const session = typeof token === 'string' ? await resolveSession(ctx, token) : null;
    if (!session) return next(noSession());
    req.user = session.user;
    req.sessionId = session.sessionId;
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

/** The session of the signed-in user; only for handlers behind requireSession. */
export function currentSessionId(req: { sessionId?: number }): number {
  if (req.sessionId === undefined) throw noSession();
  return req.sessionId;
}
