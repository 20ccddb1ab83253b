import { like, sql } from 'drizzle-orm';
import supertest from 'supertest';
import { afterEach, describe, expect, it } from 'vitest';
import { rateCounters } from '../../server/db/schema';
import type { RunningServer } from '../../server/server';
import { lastMailTo, linkIn } from '../helpers/mailbox';
import { ADMIN, AS_CLIENT, resetDatabase, startTestServer } from '../helpers/testServer';

/** Servers behind a trusted proxy, so each test can speak from the address it names in X-Forwarded-For. */
const running: RunningServer[] = [];
async function server(overrides: Record<string, string> = {}) {
  const app = await startTestServer({ TRUST_PROXY: '1', LOGIN_MAX_FAILURES: '3', LOGIN_WINDOW_MINUTES: '15', ...overrides });
  if (running.length === 0) await resetDatabase(app);
  running.push(app);
  return app;
}
afterEach(async () => {
  while (running.length) await running.pop()!.stop();
});

const attempt = (app: RunningServer, from: string, email: string, password: string) =>
  supertest(app.server).post('/api/auth/login').set(AS_CLIENT).set('X-Forwarded-For', from).send({ email, password });

/** Lets the account's current delay pass, as if the guesser had waited Retry-After seconds. */
const letDelayPass = (app: RunningServer) => app.ctx.db.update(rateCounters).set({ nextAllowedAt: sql`NOW(3)` }).where(like(rateCounters.counterKey, 'login-account:%'));

describe('failed sign-ins per address (3 per 15 minutes here)', () => {
  it('when one address has failed 3 times, then its next attempt is 429 with Retry-After, whatever the account or password', async () => {
    const app = await server();
    for (let i = 0; i < 3; i++) expect((await attempt(app, '192.0.2.1', `someone${i}@test.example`, 'guess')).status).toBe(401);
    const refused = await attempt(app, '192.0.2.1', ADMIN.email, ADMIN.password);
    expect(refused.status).toBe(429);
    expect(refused.body.error.code).toBe('too_many_attempts');
    const retryAfter = Number(refused.headers['retry-after']);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(15 * 60);
  });

  it('when the attacker at address A has failed 10 times, then the owner signs in from address B at once', async () => {
    const app = await server({ LOGIN_MAX_FAILURES: '10', LOGIN_ACCOUNT_FREE_FAILURES: '10' });
    for (let i = 0; i < 10; i++) expect((await attempt(app, '198.51.100.66', ADMIN.email, `guess-${i}`)).status).toBe(401);
    expect((await attempt(app, '198.51.100.66', ADMIN.email, 'guess-10')).status).toBe(429);
    expect((await attempt(app, '203.0.113.5', ADMIN.email, ADMIN.password)).status).toBe(200);
  });

  it('when sign-ins succeed, then they are not counted as failures', async () => {
    const app = await server();
    for (let i = 0; i < 5; i++) expect((await attempt(app, '192.0.2.2', ADMIN.email, ADMIN.password)).status).toBe(200);
    expect((await attempt(app, '192.0.2.2', ADMIN.email, 'wrong')).status).toBe(401);
  });

  it('when two server processes share the database, then they share the count', async () => {
    const first = await server();
    const second = await server();
    expect((await attempt(first, '192.0.2.3', 'a@test.example', 'guess')).status).toBe(401);
    expect((await attempt(second, '192.0.2.3', 'b@test.example', 'guess')).status).toBe(401);
    expect((await attempt(first, '192.0.2.3', 'c@test.example', 'guess')).status).toBe(401);
    expect((await attempt(second, '192.0.2.3', ADMIN.email, ADMIN.password)).status).toBe(429);
    expect((await attempt(first, '192.0.2.3', ADMIN.email, ADMIN.password)).status).toBe(429);
  });
});

describe('failed sign-ins per account: a growing delay, never a lock-out', () => {
  /** Guesses from a new address each time, so only the account's own delay applies. */
  let address = 0;
  const guess = (app: RunningServer, password = 'wrong-guess') => attempt(app, `10.0.${Math.floor(++address / 250)}.${address % 250}`, ADMIN.email, password);

  it('when someone guesses from many addresses, then after 5 failures each attempt waits 1, 2, 4 … s (at most 30), the password unchecked meanwhile, and the owner gets in once it passes', async () => {
    const app = await server();
    for (let i = 1; i <= 5; i++) expect((await guess(app)).status, `failure ${i}`).toBe(401);
    // Failures 6 to 10, each after its wait (1, 2, 4, 8 s): the 10th sets a wait of 16 s.
    for (let i = 6; i <= 10; i++) {
      await letDelayPass(app);
      expect((await guess(app)).status, `failure ${i}`).toBe(401);
    }
    const during = await guess(app, ADMIN.password);
    expect(during.status).toBe(429);
    expect(during.body.error.code).toBe('too_many_attempts');
    expect(Number(during.headers['retry-after'])).toBeGreaterThan(8);
    expect(Number(during.headers['retry-after'])).toBeLessThanOrEqual(16);

    // Failures 11 to 15 would wait 32, 64 … s; the cap holds them at 30.
    for (let i = 11; i <= 15; i++) {
      await letDelayPass(app);
      expect((await guess(app)).status, `failure ${i}`).toBe(401);
    }
    const capped = await guess(app, ADMIN.password);
    expect(capped.status).toBe(429);
    expect(Number(capped.headers['retry-after'])).toBeGreaterThan(16);
    expect(Number(capped.headers['retry-after'])).toBeLessThanOrEqual(30);

    await letDelayPass(app);
    expect((await guess(app, ADMIN.password)).status).toBe(200);
    // The success cleared the account: five free failures again.
    for (let i = 1; i <= 5; i++) expect((await guess(app)).status, `failure ${i} after the success`).toBe(401);
  });

  it('when twenty guesses arrive at once, then only the five free failures and the one that starts the first delay are checked', async () => {
    const app = await server();
    const answers = await Promise.all(Array.from({ length: 20 }, () => guess(app)));
    const statuses = answers.map((r) => r.status);
    expect(statuses.filter((s) => s === 401)).toHaveLength(6);
    expect(statuses.filter((s) => s === 429)).toHaveLength(14);
  });

  it('when the owner resets the password by mail, then the delay is gone', async () => {
    const app = await server();
    for (let i = 1; i <= 5; i++) await guess(app);
    for (let i = 6; i <= 9; i++) {
      await letDelayPass(app);
      expect((await guess(app)).status).toBe(401);
    }
    expect((await guess(app, ADMIN.password)).status).toBe(429);
    await supertest(app.server).post('/api/auth/reset-request').send({ email: ADMIN.email });
    const token = new URL(linkIn((await lastMailTo(app, ADMIN.email)).text, '/set-password')).searchParams.get('token');
    expect((await supertest(app.server).post('/api/auth/set-password').send({ token, password: 'a-brand-new-password' })).status).toBe(204);
    expect((await guess(app, 'a-brand-new-password')).status).toBe(200);
  });
});
