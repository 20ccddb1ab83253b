import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import supertest from 'supertest';
import { CLIENT_HEADER, CLIENT_HEADER_VALUE } from '../../shared/clientHeader';
import type { Config } from '../../server/config';
import { startServer, type RunningServer } from '../../server/server';
import { ensureBootstrapAdmin } from '../../server/services/userService';

export const ADMIN = { email: 'admin@test.example', password: 'admin-password-1' };

export function testDatabaseUrl(): string {
  const url = process.env.TEST_DATABASE_URL;
  if (!url) throw new Error('TEST_DATABASE_URL is not set: run the tests with `npm test`, which starts the test database');
  return url;
}

/** The real server on port 0 against the test database, with a bootstrap admin and fast hashing. */
export async function startTestServer(overrides: Partial<Record<keyof Config, string>> = {}): Promise<RunningServer> {
  return startServer({
    DATABASE_URL: testDatabaseUrl(),
    PORT: '0',
    HOST: '127.0.0.1',
    NODE_ENV: 'test',
    DATA_DIR: mkdtempSync(path.join(tmpdir(), 'crestline-test-')),
    SERVE_CLIENT: '0',
    RUN_WORKER: '0',
    BCRYPT_COST: '4',
    SMTP_SINK_PORT: '0',
    ADMIN_EMAIL: ADMIN.email,
    ADMIN_PASSWORD: ADMIN.password,
    ...overrides,
  });
}

/** Empties every table but the migrations journal (then re-creates the bootstrap admin), so each test file starts from a known state. */
export async function resetDatabase(running: RunningServer): Promise<void> {
  const db = running.ctx.db;
  const [rows] = (await db.execute(sql`SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE() AND table_name <> '__drizzle_migrations'`)) as unknown as [{ t: string }[]];
  await db.execute(sql`SET FOREIGN_KEY_CHECKS = 0`);
  for (const { t } of rows) await db.execute(sql.raw(`TRUNCATE TABLE \`${t}\``));
  await db.execute(sql`SET FOREIGN_KEY_CHECKS = 1`);
  await ensureBootstrapAdmin(running.ctx);
}

/** The header Crestline's own client sends on every API call: `.set(AS_CLIENT)` on a bare supertest request. */
export const AS_CLIENT = { [CLIENT_HEADER]: CLIENT_HEADER_VALUE };

/**
 * A supertest agent that keeps cookies and, like Crestline's own client, sends its header on every
 * request (else state-changing requests with the cookie are refused as cross-origin).
 */
export function browserAgent(running: RunningServer) {
  return supertest.agent(running.server).set(AS_CLIENT);
}

/** A browser-like agent (cookies, client header), signed in as the given account. */
export async function signedIn(running: RunningServer, email: string, password: string) {
  const agent = browserAgent(running);
  const res = await agent.post('/api/auth/login').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

/** Creates a user through the admin API and returns an agent signed in as them. */
export async function userAgent(running: RunningServer, user: { email: string; name: string; role: 'admin' | 'engineer' | 'viewer' }) {
  const admin = await signedIn(running, ADMIN.email, ADMIN.password);
  const password = `password-of-${user.email}`;
  const res = await admin.post('/api/users').send({ ...user, password });
  if (res.status !== 201) throw new Error(`creating ${user.email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return signedIn(running, user.email, password);
}
