import type { ErrorRequestHandler, Request, RequestHandler } from 'express';
import { ipKeyGenerator } from 'express-rate-limit';
import type { AppContext } from '../context';
import { countRequest, TooManyRequests } from '../services/requestLimits';

/**
 * The address a request is counted under: Express's req.ip (which honours TRUST_PROXY), with IPv6
 * addresses cut to their /56 network, since one client usually holds a whole /64 or more.
 */
export const clientAddress = (req: Request) => ipKeyGenerator(req.ip ?? req.socket.remoteAddress ?? 'unknown');

export interface LimitRule {
  /** Names the counter, e.g. 'shared-ip'. */
  name: string;
  key: (req: Request) => string;
  limit: number;
  windowS: number;
}

/** Counts the request under every rule, in order, and answers 429 at the first one that is over. */
export function limitRequests(ctx: AppContext, rules: LimitRule[], refusal: { code: string; message: string }): RequestHandler {
  return async (req, _res, next) => {
    for (const rule of rules) await countRequest(ctx, `${rule.name}:${rule.key(req)}`, rule.limit, rule.windowS, refusal);
    next();
  };
}

/** Sets Retry-After on a 429; the one error handler then writes the body. */
export const retryAfterHeader: ErrorRequestHandler = (err, _req, res, next) => {
  if (err instanceof TooManyRequests && !res.headersSent) res.set('Retry-After', String(err.retryAfterS));
  next(err);
};
