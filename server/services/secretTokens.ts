import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';

/** A new URL-safe token with 192 bits of randomness, and the SHA-256 that is all the database keeps of it. */
export function newSecretToken(): { token: string; hash: string } {
  const token = randomBytes(24).toString('base64url');
  return { token, hash: hashSecretToken(token) };
}

export const hashSecretToken = (token: string) => createHash('sha256').update(token, 'utf8').digest('hex');

/** Compares two hex hashes in constant time. */
export function sameHash(a: string, b: string): boolean {
  const x = Buffer.from(a, 'hex');
  const y = Buffer.from(b, 'hex');
  return x.length === y.length && timingSafeEqual(x, y);
}
