import type { RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { Config } from '../config';
import { AppError } from '../errors';

/**
 * Failed sign-ins counted per address and per account (successful ones are not counted), so neither
 * one address trying many accounts nor many addresses trying one account gets far.
 */
export function loginRateLimits(config: Config): RequestHandler[] {
  const windowMs = config.LOGIN_WINDOW_MINUTES * 60_000;
  const common = {
    windowMs,
    limit: config.LOGIN_MAX_FAILURES,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
    handler: () => {
      throw new AppError(429, 'too_many_attempts', `Too many failed sign-ins; try again in ${config.LOGIN_WINDOW_MINUTES} minutes`);
    },
  };
  return [
    rateLimit(common),
    rateLimit({
      ...common,
      keyGenerator: (req) => `account:${String(req.body?.email ?? '').trim().toLowerCase()}`,
      validate: { keyGeneratorIpFallback: false },
    }),
  ];
}
