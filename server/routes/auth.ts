import { Router, type Response } from 'express';
import { ChangePasswordRequest, LoginRequest } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { currentUser, requireSession } from '../middleware/auth';
import { loginRateLimits } from '../middleware/loginRateLimit';
import { authenticate, changePassword } from '../services/authService';
import { SESSION_COOKIE, signSession } from '../services/sessionTokens';

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
    .post('/auth/login', ...loginRateLimits(ctx.config), async (req, res) => {
      const user = await authenticate(ctx, LoginRequest.parse(req.body));
      res.cookie(SESSION_COOKIE, await signSession(ctx.sessionKey, user.id, ctx.config.SESSION_DAYS), cookie(req.secure));
      res.json({ user });
    })
    .post('/auth/logout', (req, res) => {
      clear(res, req.secure).status(204).end();
    })
    .get('/auth/me', requireSession(ctx), (req, res) => {
      res.json({ user: currentUser(req) });
    })
    .post('/auth/password', requireSession(ctx), async (req, res) => {
      await changePassword(ctx, currentUser(req).id, ChangePasswordRequest.parse(req.body));
      res.status(204).end();
    });
}
