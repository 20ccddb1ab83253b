import { jwtVerify, SignJWT } from 'jose';

export const SESSION_COOKIE = 'crestline_session';

/** A signed session token naming the user; the user's role and state are re-read on every request. */
export async function signSession(key: Uint8Array, userId: number, days: number): Promise<string> {
  return new SignJWT({})
    .setProtectedHeader({ alg: 'HS256' })
    .setSubject(String(userId))
    .setIssuedAt()
    .setExpirationTime(`${Math.round(days * 24)}h`)
    .sign(key);
}

/** The user id in a valid, unexpired token, or null. */
export async function verifySession(key: Uint8Array, token: string): Promise<number | null> {
  try {
    const { payload } = await jwtVerify(token, key, { algorithms: ['HS256'] });
    const id = Number(payload.sub);
    return Number.isInteger(id) && id > 0 ? id : null;
  } catch {
    return null;
  }
}
