import { Router, type Response } from 'express';
import { ChangePasswordRequest, LoginRequest } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { currentSessionId, currentUser, requireSession, sessionOnly } from '../middleware/auth';
import { bearerToken } from '../middleware/bearer';
import { clientAddress } from '../middleware/requestLimits';
import { sameOriginOnly } from '../middleware/sameOrigin';
import { changePassword, signIn } from '../services/authService';
import { endOtherSessions, endSessionOfToken, ownSessions } from '../services/sessionService';
import { SESSION_COOKIE } from '../services/sessionTokens';

export function authRoutes(ctx: AppContext): Router {
  const cookie = (secure: boolean) => ({
    httpOnly: true,
    sameSite: 'lax' as const,
    secure,
    path: '/',
    maxAge: ctx.config.SESSION_DAYS * 24 * 3600 * 1000,
  });
  const clear = (res: Response, secure: boolean) => res.clearCookie(SESSION_COOKIE, { ...cookie(secure), maxAge: undefined });

  return Router()
    .post('/auth/login', sameOriginOnly(ctx), async (req, res) => {
      const { user, token } = await signIn(ctx, LoginRequest.parse(req.body), { address: clientAddress(req), userAgent: req.get('user-agent') });
      res.cookie(SESSION_COOKIE, token, cookie(req.secure));
      res.json({ user });
    })
    // Ends this session on the server too: a copy of the cookie stops working as well. A request with
    // an API token passed the origin check on the token's account, so it leaves the cookie alone.
    .post('/auth/logout', async (req, res) => {
      if (bearerToken(req) !== null) return void res.status(204).end();
      const token = req.cookies?.[SESSION_COOKIE];
      if (typeof token === 'string') await endSessionOfToken(ctx, token);
      clear(res, req.secure).status(204).end();
    })
    .get('/auth/me', requireSession(ctx), (req, res) => {
      res.json({ user: currentUser(req) });
    })
    .post('/auth/password', requireSession(ctx), sessionOnly(), async (req, res) => {
      await changePassword(ctx, currentUser(req).id, currentSessionId(req), ChangePasswordRequest.parse(req.body));
      res.status(204).end();
    })
    .get('/auth/sessions', requireSession(ctx), sessionOnly(), async (req, res) => {
      res.json({ items: await ownSessions(ctx, currentUser(req).id, currentSessionId(req)) });
    })
    // "Sign out other sessions": every one of the user's sessions but the one asking.
    .delete('/auth/sessions', requireSession(ctx), sessionOnly(), async (req, res) => {
      await endOtherSessions(ctx, currentUser(req).id, currentSessionId(req));
      res.status(204).end();
    });
}
