import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiTokens } from '../../server/db/schema';
import type { RunningServer } from '../../server/server';
import { hashSecretToken } from '../../server/services/secretTokens';
import { sineCsv, waitSettled } from '../helpers/captures';
import { ADMIN, resetDatabase, signedIn, startTestServer, userAgent } from '../helpers/testServer';
import { newToken, tokenAgent } from '../helpers/tokens';

type Agent = Awaited<ReturnType<typeof signedIn>>;
let app: RunningServer;
let admin: Agent;
let eng: Agent;
let engId: number;
beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1' });
  await resetDatabase(app);
  admin = await signedIn(app, ADMIN.email, ADMIN.password);
  eng = await userAgent(app, { email: 'rig-owner@lab.example', name: 'Rig Owner', role: 'engineer' });
  engId = (await eng.get('/api/auth/me')).body.user.id;
});
afterAll(() => app.stop());

describe('creating, listing and revoking one’s own tokens', () => {
  it('when an engineer creates a token, then it is shown once, recognisable, and only its SHA-256 is kept', async () => {
    const res = await eng.post('/api/tokens').send({ name: 'Bench 2 rig', expiresInDays: 30 });
    expect(res.status).toBe(201);
    expect(Object.keys(res.body).sort()).toEqual(['id', 'token']);
    expect(res.body.token).toMatch(/^crl_[A-Za-z0-9_-]{32}$/);
    const [row] = await app.ctx.db.select().from(apiTokens).where(eq(apiTokens.id, res.body.id));
    expect(row.tokenHash).toBe(hashSecretToken(res.body.token));
    expect(JSON.stringify(row)).not.toContain(res.body.token.slice(4));
    const listed = (await eng.get('/api/tokens')).body.items.find((t: { id: number }) => t.id === res.body.id);
    expect(listed).toMatchObject({ name: 'Bench 2 rig', hint: res.body.token.slice(-4), readOnly: false, lastUsedAt: null });
    expect(JSON.stringify(listed)).not.toContain(res.body.token);
    const days = (Date.parse(listed.expiresAt) - Date.parse(listed.createdAt)) / 86_400_000;
    expect(days).toBeCloseTo(30, 1);
  });

  it('names and lifetimes are bounded: a name of 1–120 characters, 1–365 days, 90 by default', async () => {
    for (const body of [{ name: '' }, { name: 'x'.repeat(121) }, { name: 'r', expiresInDays: 0 }, { name: 'r', expiresInDays: 366 }, { name: 'r', expiresInDays: 1.5 }]) {
      expect((await eng.post('/api/tokens').send(body)).status).toBe(400);
    }
    const { id } = await newToken(eng, { name: 'x'.repeat(120) });
    const t = (await eng.get('/api/tokens')).body.items.find((i: { id: number }) => i.id === id);
    expect((Date.parse(t.expiresAt) - Date.parse(t.createdAt)) / 86_400_000).toBeCloseTo(90, 1);
  });

  it('when a token is used, then its owner sees when, and it acts as its owner', async () => {
    const { id, token } = await newToken(eng);
    const me = await tokenAgent(app, token).get('/api/auth/me');
    expect(me.body.user).toMatchObject({ id: engId, role: 'engineer' });
    const t = (await eng.get('/api/tokens')).body.items.find((i: { id: number }) => i.id === id);
    expect(t.lastUsedAt).not.toBeNull();
  });

  it('when its owner revokes a token, then it answers 401 at once, and someone else cannot revoke it (404)', async () => {
    const other = await userAgent(app, { email: 'other@lab.example', name: 'Other', role: 'engineer' });
    const { id, token } = await newToken(eng);
    expect((await other.delete(`/api/tokens/${id}`)).status).toBe(404);
    expect((await tokenAgent(app, token).get('/api/projects')).status).toBe(200);
    expect((await eng.delete(`/api/tokens/${id}`)).status).toBe(204);
    const refused = await tokenAgent(app, token).get('/api/projects');
    expect(refused.status).toBe(401);
    expect(refused.body.error.code).toBe('invalid_token');
    expect(refused.headers['www-authenticate']).toMatch(/^Bearer/);
  });

  it('when an admin lists every token, then each comes with its owner, and an admin revokes any of them', async () => {
    const { id, token } = await newToken(eng, { name: 'Old rig' });
    expect((await eng.get('/api/admin/tokens')).status).toBe(403);
    const all = (await admin.get('/api/admin/tokens')).body.items;
    expect(all.find((t: { id: number }) => t.id === id)).toMatchObject({ name: 'Old rig', owner: { id: engId, email: 'rig-owner@lab.example' } });
    expect((await admin.delete(`/api/tokens/${id}`)).status).toBe(204);
    expect((await tokenAgent(app, token).get('/api/auth/me')).status).toBe(401);
  });

  it('a user holds at most 50 live tokens, even when 55 are asked for at once', async () => {
    const hoarder = await userAgent(app, { email: 'hoarder@lab.example', name: 'Hoarder', role: 'viewer' });
    const answers = await Promise.all(Array.from({ length: 55 }, (_, i) => hoarder.post('/api/tokens').send({ name: `t${i}` })));
    expect(answers.filter((r) => r.status === 201)).toHaveLength(50);
    expect(answers.filter((r) => r.status === 409).map((r) => r.body.error.code)).toEqual(Array(5).fill('too_many_tokens'));
    expect((await hoarder.get('/api/tokens')).body.items).toHaveLength(50);
  });
});

describe('a bench rig uploads with its token', () => {
  it('curl -F file=@capture.csv -F projectId=…, then polls the status until ready', async () => {
    const project = (await eng.post('/api/projects').send({ name: 'Bench 2' })).body.project.id;
    const rig = tokenAgent(app, (await newToken(eng, { name: 'Bench 2 rig' })).token);
    const up = await rig.post('/api/captures').attach('file', Buffer.from(sineCsv(325, 50, 10000, 0.2)), 'capture.csv').field('projectId', String(project));
    expect(up.status).toBe(202);
    expect((await waitSettled(rig, up.body.id)).status).toBe('ready');
    expect((await rig.get(`/api/captures/${up.body.id}`)).body.uploadedBy.id).toBe(engId);
  });
});
