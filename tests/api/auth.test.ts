import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { ADMIN, AS_CLIENT, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

let app: RunningServer;
beforeAll(async () => {
  app = await startTestServer();
  await resetDatabase(app);
});
afterAll(() => app.stop());

describe('POST /api/auth/login', () => {
  it('with good credentials: 200 with the user and an httpOnly, SameSite=Lax session cookie', async () => {
    const res = await supertest(app.server).post('/api/auth/login').set(AS_CLIENT).send({ email: ADMIN.email, password: ADMIN.password });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: ADMIN.email, role: 'admin' });
    expect(res.body.user.passwordHash).toBeUndefined();
    const cookie = res.headers['set-cookie'][0];
    expect(cookie).toMatch(/^crestline_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i); // served over plain HTTP here
  });

  it('sets the Secure flag when the request came over HTTPS', async () => {
    app.server.removeAllListeners('request');
    // Express reads req.secure from the socket: simulate a TLS socket on the same app.
    const { createApp } = await import('../../server/app');
    const express = createApp(app.ctx);
    const res = await supertest((req: import('http').IncomingMessage, r: import('http').ServerResponse) => {
      (req.socket as unknown as { encrypted: boolean }).encrypted = true;
      express(req as never, r as never);
    })
      .post('/api/auth/login')
      .set(AS_CLIENT)
      .send({ email: ADMIN.email, password: ADMIN.password });
    app.server.on('request', express);
    expect(res.status).toBe(200);
    expect(res.headers['set-cookie'][0]).toMatch(/Secure/);
  });

  it('behind a trusted TLS proxy (TRUST_PROXY), the cookie is Secure too', async () => {
    const proxied = await startTestServer({ TRUST_PROXY: '1' });
    try {
      const res = await supertest(proxied.server).post('/api/auth/login').set(AS_CLIENT).set('X-Forwarded-Proto', 'https').send({ email: ADMIN.email, password: ADMIN.password });
      expect(res.status).toBe(200);
      expect(res.headers['set-cookie'][0]).toMatch(/Secure/);
    } finally {
      await proxied.stop();
    }
  });

  it('with a wrong password or an unknown e-mail: the same 401, which does not tell them apart', async () => {
    const wrong = await supertest(app.server).post('/api/auth/login').set(AS_CLIENT).send({ email: ADMIN.email, password: 'not-the-password' });
    const unknown = await supertest(app.server).post('/api/auth/login').set(AS_CLIENT).send({ email: 'nobody@test.example', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(unknown.body).toEqual(wrong.body);
    expect(wrong.body.error.code).toBe('bad_credentials');
  });

  it('with a malformed body: 400 in the one error shape', async () => {
    const res = await supertest(app.server).post('/api/auth/login').set(AS_CLIENT).send({ email: 'not-an-email' });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'invalid_request' });
    expect(typeof res.body.error.message).toBe('string');
  });
});

describe('sessions', () => {
  it('GET /api/auth/me: the user with a session, 401 without', async () => {
    const agent = await signedIn(app, ADMIN.email, ADMIN.password);
    expect((await agent.get('/api/auth/me')).body.user.email).toBe(ADMIN.email);
    const anon = await supertest(app.server).get('/api/auth/me');
    expect(anon.status).toBe(401);
    expect(anon.body.error.code).toBe('unauthenticated');
  });

  it('every other /api route answers 401 without a valid session', async () => {
    for (const [method, path] of [['get', '/api/projects'], ['post', '/api/projects'], ['get', '/api/users'], ['patch', '/api/projects/1'], ['get', '/api/anything']] as const) {
      const res = await supertest(app.server)[method](path).send({});
      expect(res.status, `${method} ${path}`).toBe(401);
    }
    const forged = await supertest(app.server).get('/api/projects').set('Cookie', 'crestline_session=eyJhbGciOiJIUzI1NiJ9.eyJzdWIiOiIxIn0.forged');
    expect(forged.status).toBe(401);
  });

  it('sign-out ends the session cookie', async () => {
    const agent = await signedIn(app, ADMIN.email, ADMIN.password);
    expect((await agent.post('/api/auth/logout')).status).toBe(204);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });

  it('a deactivated user is refused at once, though the cookie is still valid', async () => {
    const admin = await signedIn(app, ADMIN.email, ADMIN.password);
    const created = await admin.post('/api/users').send({ email: 'leaver@test.example', name: 'Leaver', role: 'engineer', password: 'leaver-password-1' });
    expect(created.status).toBe(201);
    const leaver = await signedIn(app, 'leaver@test.example', 'leaver-password-1');
    expect((await leaver.get('/api/projects')).status).toBe(200);
    expect((await admin.patch(`/api/users/${created.body.user.id}`).send({ active: false })).status).toBe(200);
    expect((await leaver.get('/api/projects')).status).toBe(401);
    const again = await supertest(app.server).post('/api/auth/login').set(AS_CLIENT).send({ email: 'leaver@test.example', password: 'leaver-password-1' });
    expect(again.status).toBe(401);
  });

  it('change password: the old one stops working', async () => {
    const admin = await signedIn(app, ADMIN.email, ADMIN.password);
    await admin.post('/api/users').send({ email: 'mover@test.example', name: 'Mover', role: 'viewer', password: 'first-password-1' });
    const mover = await signedIn(app, 'mover@test.example', 'first-password-1');
    expect((await mover.post('/api/auth/password').send({ currentPassword: 'wrong', newPassword: 'second-password-2' })).status).toBe(400);
    expect((await mover.post('/api/auth/password').send({ currentPassword: 'first-password-1', newPassword: 'second-password-2' })).status).toBe(204);
    expect((await supertest(app.server).post('/api/auth/login').set(AS_CLIENT).send({ email: 'mover@test.example', password: 'first-password-1' })).status).toBe(401);
    expect((await supertest(app.server).post('/api/auth/login').set(AS_CLIENT).send({ email: 'mover@test.example', password: 'second-password-2' })).status).toBe(200);
  });

  it('security headers: a Content-Security-Policy and no X-Powered-By', async () => {
    const res = await supertest(app.server).get('/api/health');
    expect(res.headers['content-security-policy']).toMatch(/default-src 'self'/);
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
