import { Router, type Request } from 'express';
import { InviteUserRequest, ResetRequest, SetPasswordRequest } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { allow, currentUser, requireSession } from '../middleware/auth';
import { clientAddress, limitRequests } from '../middleware/requestLimits';
import { inviteUser, requestPasswordReset, setPasswordWithLink } from '../services/accountLinkService';
import { hashSecretToken } from '../services/secretTokens';

/**
 * Every request counts here, successful or not (a reset request always "succeeds"): per address, and per
 * e-mail or link (hashed), in the database's shared counters. `name` keeps each route's counts apart.
 */
function linkLimits(ctx: AppContext, name: string) {
  const limit = ctx.config.LOGIN_MAX_FAILURES;
  const windowS = ctx.config.LOGIN_WINDOW_MINUTES * 60;
  const target = (req: Request) => hashSecretToken(typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : String(req.body?.token ?? ''));
  return limitRequests(
    ctx,
    [
      { name: `${name}-ip`, key: clientAddress, limit, windowS },
      { name: `${name}-for`, key: target, limit, windowS },
    ],
    { code: 'too_many_attempts', message: 'Too many requests' },
  );
}

export function accountLinkRoutes(ctx: AppContext): Router {
  return Router()
    .post('/auth/reset-request', linkLimits(ctx, 'reset'), async (req, res) => {
      await requestPasswordReset(ctx, ResetRequest.parse(req.body).email);
      res.status(202).json({ message: 'If that address belongs to an account, a reset link is on its way.' });
    })
    .post('/auth/set-password', linkLimits(ctx, 'set-password'), async (req, res) => {
      await setPasswordWithLink(ctx, SetPasswordRequest.parse(req.body));
      res.status(204).end();
    })
    .post('/users/invite', requireSession(ctx), allow('admin'), async (req, res) => {
      res.status(201).json({ user: await inviteUser(ctx, currentUser(req), InviteUserRequest.parse(req.body)) });
    });
}
