import { eq, sql } from 'drizzle-orm';
import { decodeJwt, SignJWT } from 'jose';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sessions } from '../../server/db/schema';
import type { RunningServer } from '../../server/server';
import { lastMailTo, linkIn } from '../helpers/mailbox';
import { ADMIN, AS_CLIENT, browserAgent, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

let app: RunningServer;
let admin: Awaited<ReturnType<typeof signedIn>>;
beforeAll(async () => {
  app = await startTestServer();
  await resetDatabase(app);
  admin = await signedIn(app, ADMIN.email, ADMIN.password);
});
afterAll(() => app.stop());

let people = 0;
/** A new engineer and their password. */
async function person() {
  const email = `person${++people}@sessions.example`;
  const password = `password-of-${email}`;
  const res = await admin.post('/api/users').send({ email, name: `Person ${people}`, role: 'engineer', password });
  expect(res.status).toBe(201);
  return { id: res.body.user.id as number, email, password };
}

/** Signs in from a "browser" of its own and returns its cookie, to replay as a copied cookie would be. */
async function cookieOf(email: string, password: string, userAgent = 'supertest') {
  const res = await supertest(app.server).post('/api/auth/login').set(AS_CLIENT).set('User-Agent', userAgent).send({ email, password });
  expect(res.status).toBe(200);
  return (res.headers['set-cookie'] as unknown as string[])[0].split(';')[0];
}
const me = (cookie: string) => supertest(app.server).get('/api/auth/me').set('Cookie', cookie);

describe('signing out', () => {
  it('when a user signs out, then a copy of the cookie stops working too', async () => {
    const p = await person();
    const cookie = await cookieOf(p.email, p.password);
    expect((await me(cookie)).status).toBe(200);
    expect((await supertest(app.server).post('/api/auth/logout').set(AS_CLIENT).set('Cookie', cookie)).status).toBe(204);
    expect((await me(cookie)).status).toBe(401);
  });

  it('when a signed-out browser signs out again, then it is simply 204', async () => {
    expect((await supertest(app.server).post('/api/auth/logout').set(AS_CLIENT)).status).toBe(204);
  });
});

describe('password change and reset', () => {
  it('when a user changes the password, then their other sessions end and the one that changed it stays', async () => {
    const p = await person();
    const laptop = await cookieOf(p.email, p.password);
    const phone = await cookieOf(p.email, p.password);
    const res = await supertest(app.server).post('/api/auth/password').set(AS_CLIENT).set('Cookie', laptop).send({ currentPassword: p.password, newPassword: 'a-new-password-1' });
    expect(res.status).toBe(204);
    expect((await me(laptop)).status).toBe(200);
    expect((await me(phone)).status).toBe(401);
  });

  it('when a user resets the password by mail, then every session of theirs ends', async () => {
    const p = await person();
    const cookie = await cookieOf(p.email, p.password);
    await supertest(app.server).post('/api/auth/reset-request').send({ email: p.email });
    const token = new URL(linkIn((await lastMailTo(app, p.email)).text, '/set-password')).searchParams.get('token');
    expect((await supertest(app.server).post('/api/auth/set-password').send({ token, password: 'after-the-reset-1' })).status).toBe(204);
    expect((await me(cookie)).status).toBe(401);
  });
});

describe('an admin ends sessions', () => {
  it('when an admin signs a user out everywhere, then every session of that user ends, and no one else’s', async () => {
    const p = await person();
    const one = await cookieOf(p.email, p.password);
    const two = await cookieOf(p.email, p.password);
    expect((await admin.delete(`/api/users/${p.id}/sessions`)).status).toBe(204);
    expect((await me(one)).status).toBe(401);
    expect((await me(two)).status).toBe(401);
    expect((await admin.get('/api/auth/me')).status).toBe(200);
    // Signing in again works: it is a sign-out, not a lock.
    expect((await me(await cookieOf(p.email, p.password))).status).toBe(200);
  });

  it('when an engineer tries it, then 403; for an unknown user, 404', async () => {
    const p = await person();
    const engineer = await signedIn(app, p.email, p.password);
    expect((await engineer.delete(`/api/users/${p.id}/sessions`)).status).toBe(403);
    expect((await admin.delete('/api/users/999999/sessions')).status).toBe(404);
  });

  it('when an admin deactivates a user, then reactivating does not revive the old sessions', async () => {
    const p = await person();
    const cookie = await cookieOf(p.email, p.password);
    expect((await admin.patch(`/api/users/${p.id}`).send({ active: false })).status).toBe(200);
    expect((await me(cookie)).status).toBe(401);
    expect((await admin.patch(`/api/users/${p.id}`).send({ active: true })).status).toBe(200);
    expect((await me(cookie)).status).toBe(401);
  });
});

describe('one’s own sessions', () => {
  it('when a user lists their sessions, then each shows its browser in short and the current one is marked', async () => {
    const p = await person();
    const firefox = await cookieOf(p.email, p.password, 'Mozilla/5.0 (X11; Linux x86_64; rv:128.0) Gecko/20100101 Firefox/128.0');
    await cookieOf(p.email, p.password, 'Mozilla/5.0 (Windows NT 10.0; Win64; x64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/131.0.0.0 Safari/537.36 Edg/131.0.0.0');
    const res = await supertest(app.server).get('/api/auth/sessions').set('Cookie', firefox);
    expect(res.status).toBe(200);
    expect(res.body.items.map((s: { userAgent: string; current: boolean }) => [s.userAgent, s.current]).sort()).toEqual([
      ['Edge on Windows', false],
      ['Firefox on Linux', true],
    ]);
  });

  it('when a user signs out their other sessions, then those end and this one stays', async () => {
    const p = await person();
    const here = await cookieOf(p.email, p.password);
    const elsewhere = await cookieOf(p.email, p.password);
    expect((await supertest(app.server).delete('/api/auth/sessions').set(AS_CLIENT).set('Cookie', here)).status).toBe(204);
    expect((await me(here)).status).toBe(200);
    expect((await me(elsewhere)).status).toBe(401);
    expect((await supertest(app.server).get('/api/auth/sessions').set('Cookie', here)).body.items).toHaveLength(1);
  });

  it('without a session, the list and the sign-out of others are 401', async () => {
    expect((await supertest(app.server).get('/api/auth/sessions')).status).toBe(401);
    expect((await supertest(app.server).delete('/api/auth/sessions').set(AS_CLIENT)).status).toBe(401);
  });
});

describe('what the server checks on every request', () => {
  it('when a session row has expired, then the cookie no longer works, though its token would still be valid', async () => {
    const p = await person();
    const cookie = await cookieOf(p.email, p.password);
    await app.ctx.db.update(sessions).set({ expiresAt: sql`NOW() - INTERVAL 1 SECOND` }).where(eq(sessions.userId, p.id));
    expect((await me(cookie)).status).toBe(401);
  });

  it('when a token is correctly signed but names no session (as tokens from before sessions did), then 401', async () => {
    const p = await person();
    const token = await new SignJWT({}).setProtectedHeader({ alg: 'HS256' }).setSubject(String(p.id)).setIssuedAt().setExpirationTime('1h').sign(app.ctx.sessionKey);
    expect((await me(`crestline_session=${token}`)).status).toBe(401);
  });

  it('when a token names a live session but another user, then 401', async () => {
    const p = await person();
    const q = await person();
    const { jti } = decodeJwt((await cookieOf(p.email, p.password)).split('=')[1]);
    const token = await new SignJWT({}).setProtectedHeader({ alg: 'HS256' }).setSubject(String(q.id)).setJti(String(jti)).setIssuedAt().setExpirationTime('1h').sign(app.ctx.sessionKey);
    expect((await me(`crestline_session=${token}`)).status).toBe(401);
  });

  it('records when a session was last seen, at most once a minute', async () => {
    const p = await person();
    const agent = browserAgent(app);
    await agent.post('/api/auth/login').send({ email: p.email, password: p.password });
    const lastSeen = async () => (await app.ctx.db.select({ at: sessions.lastSeenAt }).from(sessions).where(eq(sessions.userId, p.id)))[0].at.getTime();
    await app.ctx.db.update(sessions).set({ lastSeenAt: sql`NOW() - INTERVAL 2 MINUTE` }).where(eq(sessions.userId, p.id));
    const before = await lastSeen();
    await agent.get('/api/auth/me');
    const touched = await lastSeen();
    expect(touched - before).toBeGreaterThanOrEqual(110_000);
    await app.ctx.db.update(sessions).set({ lastSeenAt: sql`NOW() - INTERVAL 30 SECOND` }).where(eq(sessions.userId, p.id));
    const recent = await lastSeen();
    await agent.get('/api/auth/me');
    expect(await lastSeen()).toBe(recent);
  });
});
