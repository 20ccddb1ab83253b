/**
 * Harmonic limit checks through the API. The invented rectifier fixture draws half-sine current pulses
 * of 50° at each crest of a 322 V-peak, 50 Hz sine: its 3rd harmonic is about 86 % of the fundamental
 * (capacitor-input model, domain notes §2b), well under Class A's 2.30 A but over Class D's 3.4 mA/W.
 * The pulses are centred on the voltage crests, so the fundamental current is in phase and P = V1·I1
 * (IEEE 1459 definitions; from memory).
 */
import { readFileSync } from 'node:fs';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { sineCsv, uploadText, waitSettled } from '../helpers/captures';
import { resetDatabase, signedIn, startTestServer, userAgent } from '../helpers/testServer';

let app: RunningServer;
let eng: Awaited<ReturnType<typeof signedIn>>;
let other: Awaited<ReturnType<typeof signedIn>>;
let viewer: Awaited<ReturnType<typeof signedIn>>;
let id: number;
let failedId: number;
const classA = { standard: 'iec61000-3-2', class: 'A', channel: 1 };

beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1' });
  await resetDatabase(app);
  eng = await userAgent(app, { email: 'eng@limits.example', name: 'Ada Engineer', role: 'engineer' });
  other = await userAgent(app, { email: 'other@limits.example', name: 'Ben Engineer', role: 'engineer' });
  viewer = await userAgent(app, { email: 'viewer@limits.example', name: 'Cy Viewer', role: 'viewer' });
  id = (await uploadText(eng, 'rectifier-current.csv', readFileSync('fixtures/waveforms/rectifier-current.csv'))).body.id;
  failedId = (await uploadText(eng, 'empty.csv', '')).body.id;
  await waitSettled(eng, id);
  await waitSettled(eng, failedId);
});
afterAll(() => app.stop());

describe('running a check (a read: every role)', () => {
  it('a viewer runs Class A on the current channel: it passes, each order with its limit in amperes', async () => {
    const res = await viewer.post(`/api/captures/${id}/compliance`).send(classA);
    expect(res.status).toBe(200);
    expect(res.body.verdict).toBe('pass');
    const third = res.body.rows.find((r: { order: number }) => r.order === 3);
    expect(third).toMatchObject({ limit: 2.3, limitPercent: null, pass: true });
    expect(third.measuredPercent).toBeGreaterThan(80);
    expect(res.body.notes[0]).toMatch(/^Indicative only/);
  });

  it('Class D takes the active power from the Power figures and fails the 3rd harmonic', async () => {
    const analysis = (await eng.get(`/api/captures/${id}/analysis`)).body.channels;
    const power = analysis[0].harmonics[0].rms * analysis[1].harmonics[0].rms; // P = V1·I1 with the current in phase
    const res = await eng.post(`/api/captures/${id}/compliance`).send({ ...classA, class: 'D' });
    expect(res.body.verdict).toBe('fail');
    const third = res.body.rows.find((r: { order: number }) => r.order === 3);
    expect(third.limit).toBeCloseTo(0.0034 * power, 2);
    expect(third.pass).toBe(false);
    expect(res.body.notes.join(' ')).toMatch(/from the Power figures/);
    // Given 400 W instead, the 3rd may reach 1.36 A, and passes.
    const given = await eng.post(`/api/captures/${id}/compliance`).send({ ...classA, class: 'D', activePower: 400 });
    expect(given.body.rows.find((r: { order: number }) => r.order === 3)).toMatchObject({ limit: 1.36, pass: true });
  });

  it('IEEE 519: the sine voltage passes; the pulse current fails against a 1.2 A load current', async () => {
    expect((await eng.post(`/api/captures/${id}/compliance`).send({ standard: 'ieee519', channel: 0, nominalVoltage: 230 })).body.verdict).toBe('pass');
    const current = await eng.post(`/api/captures/${id}/compliance`).send({ standard: 'ieee519', kind: 'current', channel: 1, nominalVoltage: 230, iscIl: 25, loadCurrent: 1.2 });
    expect(current.body.verdict).toBe('fail');
    expect(current.body.rows.at(-1)).toMatchObject({ quantity: 'tdd', order: null, limitPercent: 8 });
    const wrongChannel = await eng.post(`/api/captures/${id}/compliance`).send({ standard: 'ieee519', channel: 1, nominalVoltage: 230 });
    expect(wrongChannel.body).toMatchObject({ verdict: 'not-applicable', reason: expect.stringMatching(/needs volts/), rows: [] });
  });

  it('a 40 Hz record is not applicable, with the reason', async () => {
    const drive = (await uploadText(eng, 'drive-40hz.csv', sineCsv(325, 40, 10000, 0.3))).body.id;
    await waitSettled(eng, drive);
    const res = await eng.post(`/api/captures/${drive}/compliance`).send({ standard: 'ieee519', channel: 0, nominalVoltage: 230 });
    expect(res.body).toMatchObject({ verdict: 'not-applicable', reason: expect.stringMatching(/40\.00 Hz/) });
  });

  it('refuses bad requests, unknown and unready captures, and strangers', async () => {
    expect((await eng.post(`/api/captures/${id}/compliance`).send({ ...classA, class: 'B' })).status).toBe(400);
    expect((await eng.post(`/api/captures/${id}/compliance`).send({ ...classA, channel: 5 })).body.error.message).toMatch(/no channel 5/);
    expect((await eng.post(`/api/captures/${id}/compliance`).send({ standard: 'ieee519', channel: 0, nominalVoltage: -1 })).status).toBe(400);
    expect((await eng.post('/api/captures/999999/compliance').send(classA)).status).toBe(404);
    expect((await eng.post(`/api/captures/${failedId}/compliance`).send(classA)).status).toBe(409);
    expect((await supertest(app.server).post(`/api/captures/${id}/compliance`).send(classA)).status).toBe(401);
  });
});

describe('keeping a check with the capture (a write: engineers and admins)', () => {
  let checkId: number;
  it('a viewer may not keep one; an engineer keeps it once, however often asked', async () => {
    expect((await viewer.post(`/api/captures/${id}/limit-checks`).send(classA)).status).toBe(403);
    const first = await eng.post(`/api/captures/${id}/limit-checks`).send(classA);
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ captureId: id, request: classA, createdBy: { name: 'Ada Engineer' }, result: { verdict: 'pass' } });
    checkId = first.body.id;
    const again = await eng.post(`/api/captures/${id}/limit-checks`).send({ channel: 1, class: 'A', standard: 'iec61000-3-2' });
    expect(again.status).toBe(200);
    expect(again.body.id).toBe(checkId);
  });

  it('everyone reads the kept checks, each with its result computed now', async () => {
    const list = await viewer.get(`/api/captures/${id}/limit-checks`);
    expect(list.status).toBe(200);
    expect(list.body.items).toHaveLength(1);
    expect(list.body.items[0].result.rows.length).toBe(39);
  });

  it('only whoever kept it (or an admin) removes it', async () => {
    expect((await viewer.delete(`/api/limit-checks/${checkId}`)).status).toBe(403);
    expect((await other.delete(`/api/limit-checks/${checkId}`)).status).toBe(403);
    expect((await eng.delete(`/api/limit-checks/${checkId}`)).status).toBe(204);
    expect((await eng.delete(`/api/limit-checks/${checkId}`)).status).toBe(404);
    expect((await eng.get(`/api/captures/${id}/limit-checks`)).body.items).toHaveLength(0);
  });

  it('keeps at most 20 per capture', async () => {
    for (let v = 0; v < 20; v++) expect((await eng.post(`/api/captures/${id}/limit-checks`).send({ standard: 'ieee519', channel: 0, nominalVoltage: 220 + v })).status).toBe(201);
    const over = await eng.post(`/api/captures/${id}/limit-checks`).send({ standard: 'ieee519', channel: 0, nominalVoltage: 400 });
    expect(over.status).toBe(409);
    expect(over.body.error.message).toMatch(/at most 20/);
  });
});
