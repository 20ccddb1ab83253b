import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { oneTimeTokens } from '../../server/db/schema';
import type { RunningServer } from '../../server/server';
import { lastMailTo, linkIn } from '../helpers/mailbox';
import { ADMIN, AS_CLIENT, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';
import { sql } from 'drizzle-orm';

let app: RunningServer;
const anon = () => supertest(app.server);
const tokenOf = (url: string) => new URL(url).searchParams.get('token')!;

beforeAll(async () => {
  app = await startTestServer({ LOGIN_MAX_FAILURES: '6' });
  await resetDatabase(app);
});
afterAll(() => app.stop());

describe('invitations', () => {
  it('an admin invites by e-mail; the invitee sets a password through a one-time link and signs in', async () => {
    const admin = await signedIn(app, ADMIN.email, ADMIN.password);
    const res = await admin.post('/api/users/invite').send({ email: 'new@team.example', name: 'New Colleague', role: 'engineer' });
    expect(res.status).toBe(201);
    const mail = await lastMailTo(app, 'new@team.example');
    expect(mail.subject).toBe('You are invited to Crestline');
    const token = tokenOf(linkIn(mail.text, '/set-password'));
    expect((await anon().post('/api/auth/login').set(AS_CLIENT).send({ email: 'new@team.example', password: 'anything-at-all' })).status).toBe(401);
    expect((await anon().post('/api/auth/set-password').send({ token, password: 'my-first-password' })).status).toBe(204);
    expect((await anon().post('/api/auth/login').set(AS_CLIENT).send({ email: 'new@team.example', password: 'my-first-password' })).status).toBe(200);
    const again = await anon().post('/api/auth/set-password').send({ token, password: 'another-password' });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('link_invalid');
  });

  it('only an admin invites', async () => {
    expect((await anon().post('/api/users/invite').send({ email: 'x@team.example', name: 'X', role: 'viewer' })).status).toBe(401);
  });
});

describe('password reset', () => {
  it('answers the same whether or not the address has an account', async () => {
    const known = await anon().post('/api/auth/reset-request').send({ email: 'new@team.example' });
    const unknown = await anon().post('/api/auth/reset-request').send({ email: 'nobody@team.example' });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
  });

  it('the link resets once, and an expired one does not', async () => {
    const mail = await lastMailTo(app, 'new@team.example');
    expect(mail.subject).toBe('Reset your Crestline password');
    const token = tokenOf(linkIn(mail.text, '/set-password'));
    expect((await anon().post('/api/auth/set-password').send({ token, password: 'second-password-2' })).status).toBe(204);
    expect((await anon().post('/api/auth/login').set(AS_CLIENT).send({ email: 'new@team.example', password: 'second-password-2' })).status).toBe(200);
    expect((await anon().post('/api/auth/set-password').send({ token, password: 'third-password-3' })).status).toBe(400);

    await anon().post('/api/auth/reset-request').send({ email: ADMIN.email });
    const adminMail = await lastMailTo(app, ADMIN.email);
    await app.ctx.db.update(oneTimeTokens).set({ expiresAt: sql`NOW() - INTERVAL 1 SECOND` });
    expect((await anon().post('/api/auth/set-password').send({ token: tokenOf(linkIn(adminMail.text, '/set-password')), password: 'hijacked-password' })).status).toBe(400);
  });

  it('is rate-limited', async () => {
    let last = 0;
    for (let i = 0; i < 8; i++) last = (await anon().post('/api/auth/reset-request').send({ email: 'flood@team.example' })).status;
    expect(last).toBe(429);
  });
});

describe('outgoing mail page', () => {
  it('an admin lists and reads the messages the local sink kept; others may not', async () => {
    const admin = await signedIn(app, ADMIN.email, ADMIN.password);
    const list = await admin.get('/api/admin/mail');
    expect(list.status).toBe(200);
    expect(list.body.items.length).toBeGreaterThan(0);
    const one = await admin.get(`/api/admin/mail/${list.body.items[0].id}`);
    expect(one.body.text.length).toBeGreaterThan(0);
    const user = await signedIn(app, 'new@team.example', 'second-password-2');
    expect((await user.get('/api/admin/mail')).status).toBe(403);
  });
});
