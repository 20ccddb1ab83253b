import { randomBytes } from 'node:crypto';
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';

/**
 * The key that signs session cookies: SESSION_SECRET when set, else a random one generated on first
 * start and kept in the private data folder so sessions survive restarts.
 */
export async function loadSessionKey(secret: string | undefined, dataDir: string): Promise<Uint8Array> {
  if (secret) return new TextEncoder().encode(secret);
  const file = path.join(dataDir, 'session-secret');
  try {
    return new Uint8Array(await readFile(file));
  } catch {
    await mkdir(dataDir, { recursive: true });
    const key = randomBytes(48);
    await writeFile(file, key, { mode: 0o600 });
    return new Uint8Array(key);
  }
}
