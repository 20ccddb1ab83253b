import { eq, sql } from 'drizzle-orm';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiTokens } from '../../server/db/schema';
import type { RunningServer } from '../../server/server';
import { sineCsv } from '../helpers/captures';
import { ADMIN, resetDatabase, signedIn, startTestServer, userAgent } from '../helpers/testServer';
import { newToken, tokenAgent } from '../helpers/tokens';

type Agent = Awaited<ReturnType<typeof signedIn>>;
let app: RunningServer;
let admin: Agent;
let eng: Agent;
let viewer: Agent;
beforeAll(async () => {
  // A low limit, so the rate-limit story needs only a few requests; every other story uses fresh tokens.
  app = await startTestServer({ TOKEN_REQUESTS_PER_MINUTE: '6' });
  await resetDatabase(app);
  admin = await signedIn(app, ADMIN.email, ADMIN.password);
  eng = await userAgent(app, { email: 'eng@attack.example', name: 'Eng', role: 'engineer' });
  viewer = await userAgent(app, { email: 'viewer@attack.example', name: 'Viewer', role: 'viewer' });
});
afterAll(() => app.stop());

const bare = () => supertest(app.server);
const FOREIGN = 'http://127.0.0.1:9999';

describe('what a token may do', () => {
  it('a read-only token reads, and anything else is 403 before it reaches a route', async () => {
    const ro = tokenAgent(app, (await newToken(eng, { readOnly: true })).token);
    expect((await ro.get('/api/projects')).status).toBe(200);
    expect((await ro.head('/api/projects')).status).toBe(200);
    for (const res of [await ro.post('/api/projects').send({ name: 'x' }), await ro.delete('/api/captures/1'), await ro.patch('/api/projects/1').send({ name: 'y' })]) {
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('read_only_token');
    }
  });

  it('a viewer’s token writes nothing: it has the viewer role, even when created without readOnly', async () => {
    const vt = tokenAgent(app, (await newToken(viewer)).token);
    const res = await vt.post('/api/projects').send({ name: 'Viewer project' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
  });

  it('a token cannot mint, list or revoke tokens, nor touch passwords and sessions: only a signed-in person can', async () => {
    const { id, token } = await newToken(eng);
    const t = tokenAgent(app, token);
    for (const res of [await t.post('/api/tokens').send({ name: 'child' }), await t.get('/api/tokens'), await t.delete(`/api/tokens/${id}`), await t.get('/api/auth/sessions'), await t.post('/api/auth/password').send({ currentPassword: 'x', newPassword: 'y'.repeat(12) })]) {
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('session_required');
    }
    const adminToken = tokenAgent(app, (await newToken(admin)).token);
    expect((await adminToken.get('/api/admin/tokens')).body.error.code).toBe('session_required');
  });
});

describe('when a token stops working', () => {
  it('an expired token: 401', async () => {
    const { id, token } = await newToken(eng);
    await app.ctx.db.update(apiTokens).set({ expiresAt: sql`NOW() - INTERVAL 1 SECOND` }).where(eq(apiTokens.id, id));
    expect((await tokenAgent(app, token).get('/api/auth/me')).status).toBe(401);
  });

  it('its owner deactivated: 401, and reactivating the owner does not revive it', async () => {
    const leaver = await userAgent(app, { email: 'leaver@attack.example', name: 'Leaver', role: 'engineer' });
    const leaverId = (await leaver.get('/api/auth/me')).body.user.id;
    const t = tokenAgent(app, (await newToken(leaver)).token);
    expect((await t.get('/api/auth/me')).status).toBe(200);
    expect((await admin.patch(`/api/users/${leaverId}`).send({ active: false })).status).toBe(200);
    expect((await t.get('/api/auth/me')).status).toBe(401);
    await admin.patch(`/api/users/${leaverId}`).send({ active: true });
    expect((await t.get('/api/auth/me')).status).toBe(401);
  });

  it('a role change applies to the next request of its tokens', async () => {
    const mover = await userAgent(app, { email: 'mover@attack.example', name: 'Mover', role: 'engineer' });
    const moverId = (await mover.get('/api/auth/me')).body.user.id;
    const t = tokenAgent(app, (await newToken(mover)).token);
    await admin.patch(`/api/users/${moverId}`).send({ role: 'viewer' });
    expect((await t.get('/api/auth/me')).body.user.role).toBe('viewer');
    expect((await t.post('/api/projects').send({ name: 'x' })).status).toBe(403);
  });
});

describe('how a token may be presented', () => {
  it('only in the Authorization header: in the query string it is not read at all', async () => {
    const { token } = await newToken(eng);
    for (const q of [`access_token=${token}`, `token=${token}`, `bearer=${token}`]) expect((await bare().get(`/api/auth/me?${q}`)).status).toBe(401);
    expect((await bare().get('/api/auth/me').set('Authorization', `bearer ${token}`)).status).toBe(200);
  });

  it('malformed or guessed tokens: 401 invalid_token, whatever their shape', async () => {
    const { token } = await newToken(eng);
    const wrongLast = token.slice(0, -1) + (token.endsWith('A') ? 'B' : 'A');
    for (const value of ['Bearer', 'Bearer ', `Bearer ${wrongLast}`, 'Bearer crl_short', `Bearer ${token.slice(4)}`, `Bearer ${'x'.repeat(5000)}`]) {
      const res = await bare().get('/api/auth/me').set('Authorization', value);
      expect({ value: value.slice(0, 40), status: res.status, code: res.body.error?.code }).toEqual({ value: value.slice(0, 40), status: 401, code: 'invalid_token' });
    }
  });

  it('with a Bearer header the cookie is ignored: an admin’s cookie does not lift a viewer’s token, nor rescue a bad one', async () => {
    const vtoken = (await newToken(viewer)).token;
    expect((await admin.get('/api/auth/me').set('Authorization', `Bearer ${vtoken}`)).body.user.role).toBe('viewer');
    expect((await admin.post('/api/projects').set('Authorization', `Bearer ${vtoken}`).send({ name: 'x' })).status).toBe(403);
    expect((await admin.get('/api/auth/me').set('Authorization', 'Bearer crl_not-a-token')).status).toBe(401);
    // Signing out with a token in the header leaves the cookie's session alone.
    expect((await admin.post('/api/auth/logout').set('Authorization', `Bearer ${vtoken}`)).status).toBe(204);
    expect((await admin.get('/api/auth/me')).status).toBe(200);
  });

  it('a token request needs no origin check (a page elsewhere cannot set the header); a cookie from there still does', async () => {
    const { token } = await newToken(eng);
    const up = await tokenAgent(app, token).post('/api/captures').set('Origin', FOREIGN).attach('file', Buffer.from(sineCsv(12, 50, 1000, 0.05)), 'rig.csv');
    expect(up.status).toBe(202);
    // A script that also kept a cookie: the token is what counts, so the origin does not matter.
    const both = await eng.post('/api/projects').set('Origin', FOREIGN).set('Authorization', `Bearer ${token}`).send({ name: 'From the rig' });
    expect(both.status).toBe(201);
    const cookieOnly = await eng.post('/api/projects').set('Origin', FOREIGN).send({ name: 'CSRF' });
    expect(cookieOnly.body.error.code).toBe('cross_origin');
  });
});

describe('rate limit per token', () => {
  it('past TOKEN_REQUESTS_PER_MINUTE a token gets 429 with Retry-After; another token and the browser go on', async () => {
    const busy = tokenAgent(app, (await newToken(eng, { name: 'Busy rig' })).token);
    for (let i = 0; i < 6; i++) expect((await busy.get('/api/projects')).status).toBe(200);
    const over = await busy.get('/api/projects');
    expect(over.status).toBe(429);
    expect(Number(over.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(over.headers['retry-after'])).toBeLessThanOrEqual(60);
    expect((await tokenAgent(app, (await newToken(eng)).token).get('/api/projects')).status).toBe(200);
    expect((await eng.get('/api/projects')).status).toBe(200);
  });
});
