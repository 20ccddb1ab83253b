import type { RequestHandler } from 'express';
import type { Role, User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { AppError, forbidden } from '../errors';
import { countTokenRequest, resolveApiToken } from '../services/apiTokenService';
import { resolveSession } from '../services/sessionService';
import { SESSION_COOKIE } from '../services/sessionTokens';
import { bearerToken } from './bearer';

declare module 'express-serve-static-core' {
  interface Request {
    user?: User;
    /** The sessions row behind the cookie, for sign-out and "sign out other sessions". */
    sessionId?: number;
    /** Set when the request came with an API token instead of a session. */
    apiToken?: { id: number; readOnly: boolean };
    /** The user's role in the project the request is about (set by projectScopes), which allow() checks. */
    projectRole?: Role;
  }
}

const noSession = () => new AppError(401, 'unauthenticated', 'Sign in to continue');
const invalidToken = () => new AppError(401, 'invalid_token', 'This API token is not valid: it may have been revoked or have expired, or its owner’s account is off');
const READ_METHODS = new Set(['GET', 'HEAD']);

/**
 * Resolves the request to a user on every request: by its API token when it has an
 * `Authorization: Bearer` header (any cookie on the same request is then ignored, since the origin
 * check lets Bearer requests through), else by the session cookie. Sessions, tokens and users are read
 * from the database each time, so a sign-out, a revocation, a deactivation or a role change takes
 * effect at once.
 */
export function requireSession(ctx: AppContext): RequestHandler {
  return async (req, res, next) => {
    const bearer = bearerToken(req);
    if (bearer !== null) {
      const resolved = await resolveApiToken(ctx, bearer);
      if (!resolved) {
        res.set('WWW-Authenticate', 'Bearer error="invalid_token"');
        return next(invalidToken());
      }
      await countTokenRequest(ctx, resolved.tokenId);
      if (resolved.readOnly && !READ_METHODS.has(req.method)) return next(new AppError(403, 'read_only_token', 'This API token is read-only: it can only read'));
      req.user = resolved.user;
      req.apiToken = { id: resolved.tokenId, readOnly: resolved.readOnly };
      return next();
    }
    const token = req.cookies?.[SESSION_COOKIE];
    const session = typeof token === 'string' ? await resolveSession(ctx, token) : null;
    if (!session) return next(noSession());
    req.user = session.user;
    req.sessionId = session.sessionId;
    next();
  };
}

/**
 * The one place roles are enforced: mount it on a route with the roles that may use it. Within a
 * project (a route under /projects/:id, /captures/:id and the like) the role checked is the user's
 * role in that project, which a member role may narrow.
 */
export function allow(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(noSession());
    if (!roles.includes(req.projectRole ?? req.user.role)) return next(forbidden());
    next();
  };
}

/**
 * For what only a signed-in person should do, never a script holding a token: managing tokens (a
 * stolen token must not mint fresh ones), passwords and sessions.
 */
export function sessionOnly(): RequestHandler {
  return (req, _res, next) => next(req.apiToken ? new AppError(403, 'session_required', 'Sign in to Crestline to do this; an API token cannot') : undefined);
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
