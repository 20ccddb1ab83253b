import supertest from 'supertest';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { ADMIN, resetDatabase, startTestServer } from '../helpers/testServer';

let app: RunningServer;
beforeEach(async () => {
  app = await startTestServer({ LOGIN_MAX_FAILURES: '3', LOGIN_WINDOW_MINUTES: '15' });
  await resetDatabase(app);
});
afterEach(() => app.stop());

const attempt = (email: string, password: string) => supertest(app.server).post('/api/auth/login').send({ email, password });

describe('failed sign-in limits (3 failures per 15 minutes here)', () => {
  it('one account: the 4th attempt is refused with 429, even with the right password', async () => {
    for (let i = 0; i < 3; i++) expect((await attempt(ADMIN.email, `guess-${i}`)).status).toBe(401);
    const res = await attempt(ADMIN.email, ADMIN.password);
    expect(res.status).toBe(429);
    expect(res.body.error.code).toBe('too_many_attempts');
  });

  it('one address trying different accounts is limited too', async () => {
    for (let i = 0; i < 3; i++) await attempt(`someone${i}@test.example`, 'guess');
    expect((await attempt('another@test.example', 'guess')).status).toBe(429);
  });

  it('successful sign-ins are not counted', async () => {
    for (let i = 0; i < 5; i++) expect((await attempt(ADMIN.email, ADMIN.password)).status).toBe(200);
    expect((await attempt(ADMIN.email, 'wrong')).status).toBe(401);
  });
});
