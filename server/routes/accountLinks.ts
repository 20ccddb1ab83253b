import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { InviteUserRequest, ResetRequest, SetPasswordRequest } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { AppError } from '../errors';
import { allow, currentUser, requireSession } from '../middleware/auth';
import { inviteUser, requestPasswordReset, setPasswordWithLink } from '../services/accountLinkService';

/** Every request counts here, successful or not: a reset request always "succeeds". */
function linkLimits(ctx: AppContext) {
  const common = {
    windowMs: ctx.config.LOGIN_WINDOW_MINUTES * 60_000,
    limit: ctx.config.LOGIN_MAX_FAILURES,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
    handler: () => {
      throw new AppError(429, 'too_many_attempts', `Too many requests; try again in ${ctx.config.LOGIN_WINDOW_MINUTES} minutes`);
    },
  };
  return [
    rateLimit(common),
    rateLimit({ ...common, keyGenerator: (req) => `email:${String(req.body?.email ?? req.body?.token ?? '').trim().toLowerCase()}`, validate: { keyGeneratorIpFallback: false } }),
  ];
}

export function accountLinkRoutes(ctx: AppContext): Router {
  return Router()
    .post('/auth/reset-request', ...linkLimits(ctx), async (req, res) => {
      await requestPasswordReset(ctx, ResetRequest.parse(req.body).email);
      res.status(202).json({ message: 'If that address belongs to an account, a reset link is on its way.' });
    })
    .post('/auth/set-password', ...linkLimits(ctx), async (req, res) => {
      await setPasswordWithLink(ctx, SetPasswordRequest.parse(req.body));
      res.status(204).end();
    })
    .post('/users/invite', requireSession(ctx), allow('admin'), async (req, res) => {
      res.status(201).json({ user: await inviteUser(ctx, currentUser(req), InviteUserRequest.parse(req.body)) });
    });
}
