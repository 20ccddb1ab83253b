import type { SessionInfo } from '../../shared/schemas/session';
import type { User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { deleteEndedSessions, findLiveSession, insertSession, listLiveSessions, revokeSession, revokeUserSessions, touchSession } from '../db/sessionRepository';
import { hashSecretToken, newSecretToken } from './secretTokens';
import { signSession, verifySession } from './sessionTokens';
import { userAgentSummary } from './userAgentSummary';

const DAY_MS = 24 * 3600 * 1000;

/** Records a new session for the user and returns the cookie value that carries its id. */
export async function startSession(ctx: AppContext, userId: number, userAgent: string | undefined): Promise<string> {
  await deleteEndedSessions(ctx.db, userId);
  const { token: sessionId, hash } = newSecretToken();
  const expiresAt = new Date(Date.now() + ctx.config.SESSION_DAYS * DAY_MS);
  await insertSession(ctx.db, { userId, idHash: hash, expiresAt, userAgent: userAgentSummary(userAgent) });
  return signSession(ctx.sessionKey, userId, sessionId, ctx.config.SESSION_DAYS);
}

/**
 * The user and session a cookie stands for, or null when the token is forged or expired, its session
 * was ended, or the user is deactivated. Role and state are read from the database on every request.
 */
export async function resolveSession(ctx: AppContext, token: string): Promise<{ user: User; sessionId: number } | null> {
  const claims = await verifySession(ctx.sessionKey, token);
  if (!claims) return null;
  const session = await findLiveSession(ctx.db, hashSecretToken(claims.sessionId));
  if (!session || session.userId !== claims.userId || !session.user.active) return null;
  if (session.stale) await touchSession(ctx.db, session.id);
  const { id, email, name, role } = session.user;
  return { user: { id, email, name, role }, sessionId: session.id };
}

/** Sign-out: ends the session the cookie stands for, if it is still live. */
export async function endSessionOfToken(ctx: AppContext, token: string): Promise<void> {
  const resolved = await resolveSession(ctx, token);
  if (resolved) await revokeSession(ctx.db, resolved.sessionId);
}

export const endOtherSessions = (ctx: AppContext, userId: number, currentSessionId: number) => revokeUserSessions(ctx.db, userId, currentSessionId);

export const endAllSessions = (ctx: AppContext, userId: number) => revokeUserSessions(ctx.db, userId);

export async function ownSessions(ctx: AppContext, userId: number, currentSessionId: number): Promise<SessionInfo[]> {
  const rows = await listLiveSessions(ctx.db, userId);
  return rows.map((r) => ({
    id: r.id,
    userAgent: r.userAgent,
    createdAt: r.createdAt.toISOString(),
    lastSeenAt: r.lastSeenAt.toISOString(),
    expiresAt: r.expiresAt.toISOString(),
    current: r.id === currentSessionId,
  }));
}
