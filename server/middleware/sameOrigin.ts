import type { Request, RequestHandler } from 'express';
import { CLIENT_HEADER, CLIENT_HEADER_VALUE } from '../../shared/clientHeader';
import type { AppContext } from '../context';
import { AppError } from '../errors';
import { bearerToken } from './bearer';
import { SESSION_COOKIE } from '../services/sessionTokens';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

const crossOrigin = () => new AppError(403, 'cross_origin', 'This request did not come from Crestline itself, so it was refused');

function originOf(url: string): string | null {
  try {
    const origin = new URL(url).origin;
    return origin === 'null' ? null : origin;
  } catch {
    return null;
  }
}

/**
 * Requests whose credential a browser cannot attach on its own need no origin check: those with an
 * API token (`Authorization: Bearer …`, a header another site's page cannot set without a CORS
 * preflight, which Crestline never grants). requireSession then ignores any cookie on the same
 * request, so the cookie cannot ride along unchecked.
 */
function carriesOwnCredential(req: Request): boolean {
  return bearerToken(req) !== null;
}

/**
 * Whether a request comes from a page of Crestline's own origin: PUBLIC_URL's origin, or the origin of
 * the address the request was sent to (its Host, with the protocol Express sees, which honours
 * TRUST_PROXY). By Origin when the browser sent one, else by Referer, else by the client header.
 */
function fromOwnOrigin(ctx: AppContext, req: Request): boolean {
  const own = new Set([originOf(ctx.publicUrl), originOf(`${req.protocol}://${req.get('host') ?? ''}`)].filter((o) => o !== null));
  const origin = req.get('origin');
  if (origin !== undefined) return own.has(origin);
  const referer = req.get('referer');
  if (referer !== undefined) {
    const refererOrigin = originOf(referer);
    return refererOrigin !== null && own.has(refererOrigin);
  }
  return req.get(CLIENT_HEADER) === CLIENT_HEADER_VALUE;
}

/**
 * CSRF defence on /api, beyond SameSite=Lax (which lets another port of the same host through): every
 * state-changing request that carries the session cookie must come from Crestline's own origin.
 * Answers 403 cross_origin otherwise.
 */
export function sameOriginForSessions(ctx: AppContext): RequestHandler {
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method) || req.cookies?.[SESSION_COOKIE] === undefined || carriesOwnCredential(req)) return next();
    next(fromOwnOrigin(ctx, req) ? undefined : crossOrigin());
  };
}

/**
 * The same check on a route that needs no cookie: signing in, so that another site cannot sign a
 * visitor in to an account of its choosing. Mounted on the route itself, so no spelling of the path
 * escapes it.
 */
export function sameOriginOnly(ctx: AppContext): RequestHandler {
  return (req, _res, next) => next(fromOwnOrigin(ctx, req) ? undefined : crossOrigin());
}
