/**
 * Channel setup: a current clamp recorded as volts becomes amperes. Expected values: a clamp of
 * 100 mV/A reads 0.1 V per ampere, so scale 10 A/V (common practice, no source); sine RMS = peak/√2
 * (standard calculus).
 */
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { sql } from 'drizzle-orm';
import { longTwoChannelCsv, sineCsv, uploadText, waitSettled } from '../helpers/captures';
import { resetDatabase, signedIn, startTestServer, userAgent } from '../helpers/testServer';

type Agent = Awaited<ReturnType<typeof signedIn>>;
let app: RunningServer;
let eng: Agent;
let other: Agent;
let viewer: Agent;
let projectId: number;
let id: number;
/** 10 A RMS through a 100 mV/A clamp: 1 V RMS on the scope. */
const clampCsv = sineCsv(Math.SQRT2, 50, 10000, 0.2);

/** Polls until no re-analysis is pending and the check holds. */
async function settledWith(agent: Agent, captureId: number, check: (c: { channels: { unit: string }[] }) => boolean) {
  const until = Date.now() + 30_000;
  for (;;) {
    const c = (await agent.get(`/api/captures/${captureId}`)).body;
    if (c.status === 'ready' && !c.reanalysing && check(c)) return c;
    if (Date.now() > until) throw new Error(`capture ${captureId} did not settle: ${JSON.stringify(c.channels)}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1' });
  await resetDatabase(app);
  eng = await userAgent(app, { email: 'eng@setup.example', name: 'Eng', role: 'engineer' });
  other = await userAgent(app, { email: 'eng2@setup.example', name: 'Other', role: 'engineer' });
  viewer = await userAgent(app, { email: 'view@setup.example', name: 'View', role: 'viewer' });
  projectId = (await eng.post('/api/projects').send({ name: 'Clamp survey' })).body.project.id;
  id = (await uploadText(eng, 'clamp.csv', clampCsv, { projectId })).body.id;
  await waitSettled(eng, id);
});
afterAll(() => app.stop());

describe('PATCH /api/captures/:id/channels/:index', () => {
  it('the uploader sets a 100 mV/A clamp: 202, then figures, samples and trend are in amperes', async () => {
    const res = await eng.patch(`/api/captures/${id}/channels/0`).send({ name: 'Clamp L1', unit: 'A', scale: 10 });
    expect(res.status).toBe(202);
    expect(res.body.channelSetup).toEqual([{ index: 0, name: 'Clamp L1', unit: 'A', scale: 10, offset: 0, invert: false }]);
    const c = await settledWith(eng, id, (d) => d.channels[0].unit === 'A');
    expect(c.channels[0]).toMatchObject({ name: 'Clamp L1', unit: 'A' });
    const a = (await eng.get(`/api/captures/${id}/analysis`)).body.channels[0];
    expect(a.rms).toBeCloseTo(10, 4);
    const s = (await eng.get(`/api/captures/${id}/samples?channel=0&fromS=0.004&toS=0.006&points=100`)).body;
    expect(Math.max(...s.values)).toBeCloseTo(10 * Math.SQRT2, 2);
    const t = (await eng.get(`/api/captures/${id}/trend?channel=0&kind=rmsHalfCycle`)).body;
    expect(t.unit).toBe('A');
    expect(t.points.length).toBeGreaterThan(15);
    t.points.forEach((p: { value: number }) => expect(p.value).toBeCloseTo(10, 1));
  });

  it('never changes the original file', async () => {
    expect((await eng.get(`/api/captures/${id}/original`)).text).toBe(clampCsv);
  });

  it('invert and offset: value = −scale·x + offset', async () => {
    expect((await eng.patch(`/api/captures/${id}/channels/0`).send({ invert: true, offset: 2 })).status).toBe(202);
    await settledWith(eng, id, () => true);
    const a = (await eng.get(`/api/captures/${id}/analysis`)).body.channels[0];
    // −10·x + 2: mean 2 A, AC part still 10 A RMS.
    expect(a.mean).toBeCloseTo(2, 3);
    expect(a.acRms).toBeCloseTo(10, 3);
  });

  it('two changes in quick succession: the last one wins (a run that started with the first is followed by another)', async () => {
    await eng.patch(`/api/captures/${id}/channels/0`).send({ scale: 20, invert: false, offset: 0 });
    await eng.patch(`/api/captures/${id}/channels/0`).send({ scale: 30 });
    const until = Date.now() + 30_000;
    let rms = 0;
    while (Date.now() < until) {
      const c = (await eng.get(`/api/captures/${id}`)).body;
      rms = (await eng.get(`/api/captures/${id}/analysis`)).body.channels[0].rms;
      if (!c.reanalysing && Math.abs(rms - 30) < 1e-3) break;
      await new Promise((r) => setTimeout(r, 100));
    }
    expect(rms).toBeCloseTo(30, 4);
  });

  it('a change made while a re-analysis is running with the old setup is applied by one more run after it', async () => {
    // Long enough (300,000 rows) that the first re-analysis is still running when the second change comes.
    const big = (await uploadText(eng, 'long.csv', longTwoChannelCsv(300_000), { projectId })).body.id;
    await waitSettled(eng, big, 60_000);
    expect((await eng.patch(`/api/captures/${big}/channels/1`).send({ scale: 2 })).status).toBe(202);
    const until = Date.now() + 20_000;
    for (;;) {
      const [rows] = (await app.ctx.db.execute(sql`SELECT status FROM jobs WHERE capture_id = ${big} AND kind = 'reanalyse' ORDER BY id DESC LIMIT 1`)) as unknown as [{ status: string }[]];
      if (rows[0]?.status === 'running') break;
      if (Date.now() > until) throw new Error('the re-analysis never ran');
      await new Promise((r) => setTimeout(r, 10));
    }
    expect((await eng.patch(`/api/captures/${big}/channels/1`).send({ scale: 3 })).status).toBe(202);
    const done = Date.now() + 60_000;
    let rms = 0;
    while (Date.now() < done) {
      const c = (await eng.get(`/api/captures/${big}`)).body;
      rms = (await eng.get(`/api/captures/${big}/analysis`)).body.channels[1].rms;
      if (!c.reanalysing && Math.abs(rms - 3 * 10 / Math.SQRT2) < 0.01) break;
      await new Promise((r) => setTimeout(r, 100));
    }
    // 10 A peak in the file (tests/helpers/captures.ts), so 30 A peak, 30/√2 A RMS (standard calculus).
    expect(rms).toBeCloseTo((3 * 10) / Math.SQRT2, 2);
  }, 120_000);

  it('bad values are a 400 that names the field; a missing channel is a 404', async () => {
    const bad = async (body: unknown, field: string) => {
      const r = await eng.patch(`/api/captures/${id}/channels/0`).send(body as object);
      expect(r.status).toBe(400);
      expect(r.body.error.message).toMatch(new RegExp(`^${field}:`));
    };
    await bad({ scale: 0 }, 'scale');
    await bad({ unit: 'Volts' }, 'unit');
    await bad({ name: 'x'.repeat(121) }, 'name');
    await bad({ offset: 'a lot' }, 'offset');
    // JSON has no Infinity, but 1e400 parses to it.
    const inf = await eng.patch(`/api/captures/${id}/channels/0`).set('content-type', 'application/json').send('{"scale": 1e400}');
    expect(inf.status).toBe(400);
    expect(inf.body.error.message).toMatch(/^scale:/);
    expect((await eng.patch(`/api/captures/${id}/channels/5`).send({ scale: 2 })).status).toBe(404);
  });

  it('only the uploader or an admin may change it: another engineer and a viewer get 403', async () => {
    expect((await other.patch(`/api/captures/${id}/channels/0`).send({ scale: 2 })).status).toBe(403);
    expect((await viewer.patch(`/api/captures/${id}/channels/0`).send({ scale: 2 })).status).toBe(403);
  });

  it('a share link shows the scaled values with the new unit', async () => {
    const share = (await eng.post(`/api/captures/${id}/shares`).send({})).body;
    const view = (await supertest(app.server).get(`/api/shared/${share.token}`)).body;
    expect(view.captures[0].capture.channels[0].unit).toBe('A');
    expect(view.captures[0].analysis.channels[0].rms).toBeCloseTo(30, 3);
    const trend = await supertest(app.server).get(`/api/shared/${share.token}/captures/${id}/trend?channel=0`);
    expect(trend.body.unit).toBe('A');
    trend.body.points.forEach((p: { value: number }) => expect(p.value).toBeCloseTo(30, 1));
    expect((await supertest(app.server).get(`/api/shared/${share.token}/captures/${id + 1000}/trend?channel=0`)).status).toBe(404);
  });
});

describe('a channel setup sent with the upload', () => {
  it('is applied from the first analysis on', async () => {
    const setup = JSON.stringify([{ index: 0, unit: 'A', scale: 10 }]);
    const up = await uploadText(eng, 'clamp-at-upload.csv', sineCsv(Math.SQRT2, 50, 10000, 0.1), { projectId, channelSetup: setup });
    const c = await waitSettled(eng, up.body.id);
    expect(c.channels[0].unit).toBe('A');
    expect((await eng.get(`/api/captures/${c.id}/analysis`)).body.channels[0].rms).toBeCloseTo(10, 4);
  });

  it('a bad one refuses the upload with the field named', async () => {
    const up = await uploadText(eng, 'bad-setup.csv', sineCsv(1, 50, 1000, 0.1), { projectId, channelSetup: JSON.stringify([{ index: 0, scale: 0 }]) });
    expect(up.status).toBe(400);
    expect(up.body.error.message).toMatch(/channelSetup\.0\.scale/);
  });
});

describe('probe presets of a project', () => {
  it('an engineer saves "clamp 100 mV/A → A"; everyone reads it; a viewer cannot add one', async () => {
    const res = await eng.post(`/api/projects/${projectId}/probe-presets`).send({ name: 'clamp 100 mV/A → A', unit: 'A', scale: 10 });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name: 'clamp 100 mV/A → A', unit: 'A', scale: 10, offset: 0, invert: false });
    expect((await viewer.get(`/api/projects/${projectId}/probe-presets`)).body.items).toHaveLength(1);
    expect((await viewer.post(`/api/projects/${projectId}/probe-presets`).send({ name: 'x', unit: 'A', scale: 1 })).status).toBe(403);
    expect((await eng.post(`/api/projects/${projectId}/probe-presets`).send({ name: 'CLAMP 100 mV/A → A', unit: 'A', scale: 10 })).status).toBe(409);
    const bad = await eng.post(`/api/projects/${projectId}/probe-presets`).send({ name: 'broken', unit: 'A', scale: 0 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/^scale:/);
    expect((await other.delete(`/api/probe-presets/${res.body.id}`)).status).toBe(403);
    expect((await eng.delete(`/api/probe-presets/${res.body.id}`)).status).toBe(204);
  });
});
