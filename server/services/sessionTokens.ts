import { jwtVerify, SignJWT } from 'jose';

export const SESSION_COOKIE = 'crestline_session';

/**
 * A signed session token naming the user and the session (jti, a random id whose hash is the sessions
 * row's key). The signature proves the token is ours; the row decides whether it is still live.
 */
export async function signSession(key: Uint8Array, userId: number, sessionId: string, days: number): Promise<string> {
  return new SignJWT({})
    .setProtectedHeader({ alg: 'HS256' })
    .setSubject(String(userId))
    .setJti(sessionId)
    .setIssuedAt()
    .setExpirationTime(`${Math.round(days * 24)}h`)
    .sign(key);
}

/** The user id and session id of a valid, unexpired token, or null (also for tokens from before sessions had ids). */
export async function verifySession(key: Uint8Array, token: string): Promise<{ userId: number; sessionId: string } | null> {
  try {
    const { payload } = await jwtVerify(token, key, { algorithms: ['HS256'] });
    const userId = Number(payload.sub);
    if (!Number.isInteger(userId) || userId <= 0 || typeof payload.jti !== 'string' || !payload.jti) return null;
    return { userId, sessionId: payload.jti };
  } catch {
    return null;
  }
}
