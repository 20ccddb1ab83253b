import { eq, sql } from 'drizzle-orm';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { shares } from '../../server/db/schema';
import type { RunningServer } from '../../server/server';
import { sineCsv, uploadText, waitSettled } from '../helpers/captures';
import { lastMailTo, linkIn } from '../helpers/mailbox';
import { resetDatabase, signedIn, startTestServer, userAgent } from '../helpers/testServer';

let app: RunningServer;
let eng: Awaited<ReturnType<typeof signedIn>>;
let viewer: Awaited<ReturnType<typeof signedIn>>;
let captureId: number;
let otherCaptureId: number;
const anon = () => supertest(app.server);

beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1' });
  await resetDatabase(app);
  eng = await userAgent(app, { email: 'e@share.example', name: 'Sharer', role: 'engineer' });
  viewer = await userAgent(app, { email: 'v@share.example', name: 'Viewer', role: 'viewer' });
  captureId = (await uploadText(eng, 'shared.csv', sineCsv(325, 50, 10000, 0.2))).body.id;
  otherCaptureId = (await uploadText(eng, 'private.csv', sineCsv(100, 50, 10000, 0.2))).body.id;
  await waitSettled(eng, captureId);
  await waitSettled(eng, otherCaptureId);
});
afterAll(() => app.stop());

describe('read-only share links', () => {
  let token: string;
  let shareId: number;

  it('an engineer shares a capture by e-mail; the message carries the link', async () => {
    const res = await eng.post(`/api/captures/${captureId}/shares`).send({ email: 'client@facility.example', message: 'Here is the inverter output we discussed.' });
    expect(res.status).toBe(201);
    expect(res.body.token.length).toBeGreaterThanOrEqual(32); // 24 random bytes, base64url
    expect(new Date(res.body.expiresAt).getTime() - Date.now()).toBeGreaterThan(13.9 * 24 * 3600 * 1000);
    token = res.body.token;
    shareId = res.body.id;
    const mail = await lastMailTo(app, 'client@facility.example');
    expect(mail.subject).toMatch(/Sharer shared the capture/);
    expect(linkIn(mail.text, '/shared/')).toBe(res.body.url);
    expect(mail.text).toMatch(/inverter output we discussed/);
    expect(mail.html).toContain(res.body.url);
  });

  it('stores only a hash of the token', async () => {
    const [row] = await app.ctx.db.select().from(shares).where(eq(shares.id, shareId));
    expect(row.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(JSON.stringify(row)).not.toContain(token);
  });

  it('opens without a cookie: capture, analysis, annotations and samples', async () => {
    const res = await anon().get(`/api/shared/${token}`);
    expect(res.status).toBe(200);
    expect(res.body.kind).toBe('capture');
    expect(res.body.sharedBy).toBe('Sharer');
    expect(res.body.captures[0].capture.id).toBe(captureId);
    // a sine's RMS is its peak over √2 (standard calculus)
    expect(res.body.captures[0].analysis.channels[0].rms).toBeCloseTo(325 / Math.SQRT2, 3);
    const samples = await anon().get(`/api/shared/${token}/captures/${captureId}/samples?channel=0&points=100`);
    expect(samples.status).toBe(200);
    expect(samples.body.mode).toBe('minmax');
  });

  it('cannot reach another capture, nor anything behind a session', async () => {
    expect((await anon().get(`/api/shared/${token}/captures/${otherCaptureId}/samples?channel=0`)).status).toBe(404);
    expect((await anon().get(`/api/captures/${otherCaptureId}`).set('Authorization', `Bearer ${token}`)).status).toBe(401);
    expect((await anon().get(`/api/captures/${captureId}/analysis`)).status).toBe(401);
  });

  it('cannot write: annotations, deletes and new shares are refused by the server', async () => {
    for (const [method, path] of [
      ['post', `/api/shared/${token}/annotations`],
      ['post', `/api/shared/${token}/captures/${captureId}/annotations`],
      ['delete', `/api/shared/${token}`],
      ['post', `/api/shared/${token}/shares`],
      ['patch', `/api/shared/${token}`],
    ] as const) {
      const res = await anon()[method](path).send({ startS: 0, endS: 0.1, label: 'x' });
      expect(res.status, `${method} ${path}`).toBe(405);
      expect(res.body.error.code).toBe('read_only');
    }
    expect((await anon().post(`/api/captures/${captureId}/annotations`).send({ startS: 0, endS: 0.1, label: 'x' })).status).toBe(401);
  });

  it('lists live links with when they were last opened and how often', async () => {
    const list = (await eng.get(`/api/captures/${captureId}/shares`)).body.items;
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({ id: shareId, email: 'client@facility.example', openCount: 1, createdBy: 'Sharer' });
    expect(list[0].lastOpenedAt).not.toBeNull();
  });

  it('a viewer cannot create or list shares', async () => {
    expect((await viewer.post(`/api/captures/${captureId}/shares`).send({})).status).toBe(403);
    expect((await viewer.get(`/api/captures/${captureId}/shares`)).status).toBe(403);
  });

  it('stops working the moment it is revoked', async () => {
    expect((await viewer.delete(`/api/shares/${shareId}`)).status).toBe(403);
    expect((await eng.delete(`/api/shares/${shareId}`)).status).toBe(204);
    expect((await anon().get(`/api/shared/${token}`)).status).toBe(404);
    expect((await anon().get(`/api/shared/${token}/captures/${captureId}/samples?channel=0`)).status).toBe(404);
  });

  it('stops working once expired', async () => {
    const res = await eng.post(`/api/captures/${captureId}/shares`).send({ expiresInDays: 1 });
    expect((await anon().get(`/api/shared/${res.body.token}`)).status).toBe(200);
    await app.ctx.db.update(shares).set({ expiresAt: sql`NOW() - INTERVAL 1 SECOND` }).where(eq(shares.id, res.body.id));
    expect((await anon().get(`/api/shared/${res.body.token}`)).status).toBe(404);
  });

  it('an unknown token is a plain 404', async () => {
    expect((await anon().get('/api/shared/AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA')).status).toBe(404);
  });

  it('a saved comparison can be shared too', async () => {
    const cmp = (await eng.post('/api/comparisons').send({ name: 'Both', captureIds: [captureId, otherCaptureId] })).body;
    const share = (await eng.post(`/api/comparisons/${cmp.id}/shares`).send({})).body;
    const view = (await anon().get(`/api/shared/${share.token}`)).body;
    expect(view.kind).toBe('comparison');
    expect(view.captures.map((c: { capture: { id: number } }) => c.capture.id)).toEqual([captureId, otherCaptureId]);
    expect((await anon().get(`/api/shared/${share.token}/captures/${otherCaptureId}/samples?channel=0&points=10`)).status).toBe(200);
  });
});
