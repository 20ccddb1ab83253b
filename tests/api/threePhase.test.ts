/**
 * The invented switchboard capture through the whole pipeline: its three-phase set, unbalance, powers,
 * the dip in Urms(1/2) and its mark suggestions. Expected values come from the capture's design
 * (231 V∠0°, 226 V∠−119°, 234 V∠121°; a dip to 72 % from 0.2 s to 0.3 s), worked out with Fortescue's
 * definitions and the NEMA MG 1 definition in Python (cmath): u2 1.5923 %, u0 0.4419 %, LVUR 1.4431 %;
 * the event thresholds of IEC 61000-4-30 (domain notes §8c, details from memory).
 */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { uploadText, waitSettled } from '../helpers/captures';
import { resetDatabase, signedIn, startTestServer, userAgent } from '../helpers/testServer';

type Agent = Awaited<ReturnType<typeof signedIn>>;
let app: RunningServer;
let eng: Agent;
let viewer: Agent;
let id: number;
const file = 'switchboard-three-phase-motor-start.csv';

async function settled(captureId: number) {
  const until = Date.now() + 30_000;
  for (;;) {
    const c = (await eng.get(`/api/captures/${captureId}`)).body;
    if (c.status === 'ready' && !c.reanalysing) return c;
    if (Date.now() > until) throw new Error('re-analysis did not finish');
    await new Promise((r) => setTimeout(r, 100));
  }
}

beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1' });
  await resetDatabase(app);
  eng = await userAgent(app, { email: 'eng@3p.example', name: 'Eng', role: 'engineer' });
  viewer = await userAgent(app, { email: 'view@3p.example', name: 'View', role: 'viewer' });
  id = (await uploadText(eng, file, readFileSync(`fixtures/waveforms/${file}`))).body.id;
  await waitSettled(eng, id);
});
afterAll(() => app.stop());

describe('GET /api/captures/:id/analysis: systems', () => {
  it('finds the wye set by its names, with its currents, and reports unbalance with sources', async () => {
    const { systems } = (await viewer.get(`/api/captures/${id}/analysis`)).body;
    expect(systems).toHaveLength(1);
    const s = systems[0];
    expect(s).toMatchObject({ kind: 'threePhase', voltageChannels: [0, 1, 2], currentChannels: [3, 4, 5], connection: 'wye', detectedBy: 'names' });
    expect(s.frequency).toBeCloseTo(50, 2);
    expect(s.unbalance.negativePercent).toBeCloseTo(1.5923, 2);
    expect(s.unbalance.zeroPercent).toBeCloseTo(0.4419, 2);
    expect(s.lineVoltageUnbalance.maxDeviationPercent).toBeCloseTo(1.4431, 2);
    expect(s.unbalanceSource).toMatch(/IEC 61000-4-30/);
    expect(s.lineVoltageUnbalance.source).toMatch(/NEMA MG 1/);
    expect(s.phaseAnglesDeg[1]).toBeCloseTo(-119, 0);
    expect(s.phaseAnglesDeg[2]).toBeCloseTo(121, 0);
    expect(s.lineToLineRms).toHaveLength(3);
    const p = s.power;
    expect(p.PF).toBeGreaterThan(0);
    expect(p.PF).toBeLessThan(1);
    // Se1² = S1+² + SU1² (IEEE 1459 §8b).
    expect(p.Se1 ** 2).toBeCloseTo(p.S1plus ** 2 + p.SU1 ** 2, -2);
  });

  it('reports the dip on each phase against the suggested 230 V, and suggests marks for it', async () => {
    const { voltageEvents } = (await viewer.get(`/api/captures/${id}/analysis`)).body;
    expect(voltageEvents.map((v: { channel: number }) => v.channel)).toEqual([0, 1, 2]);
    for (const v of voltageEvents) {
      expect(v).toMatchObject({ declaredVoltage: 230, declaredFrom: 'suggested' });
      expect(v.thresholdsSource).toMatch(/IEC 61000-4-30/);
      expect(v.events).toHaveLength(1);
      const e = v.events[0];
      expect(e.kind).toBe('dip');
      expect(Math.abs(e.startS - 0.2)).toBeLessThanOrEqual(0.0101);
      expect(Math.abs(e.durationS - 0.1)).toBeLessThanOrEqual(0.0201);
    }
    expect(voltageEvents[0].events[0].extremeV).toBeCloseTo(0.72 * 231, 0);
    const marks = (await viewer.get(`/api/captures/${id}/annotations`)).body.items as { label: string; reason: string; state: string }[];
    const dips = marks.filter((m) => m.label === 'Voltage dip');
    expect(dips).toHaveLength(3);
    expect(dips[0].state).toBe('suggested');
    expect(dips[0].reason).toMatch(/declared 230\.0 V.*IEC 61000-4-30/);
  });

  it('the trend shows the dip: Urms(1/2) of L1 falls to about 166 V', async () => {
    const t = (await viewer.get(`/api/captures/${id}/trend?channel=0&kind=rmsHalfCycle&points=50`)).body;
    expect(t.points.length).toBeLessThanOrEqual(50);
    expect(Math.min(...t.points.map((p: { value: number }) => p.value))).toBeCloseTo(0.72 * 231, 0);
    const f = (await viewer.get(`/api/captures/${id}/trend?channel=0&kind=frequencyCycle`)).body;
    expect(f.unit).toBe('Hz');
    f.points.forEach((p: { value: number }) => expect(p.value).toBeCloseTo(50, 1));
    // A span is read with a cycle either side: its values are those of the whole record, within the span.
    const zoomed = (await viewer.get(`/api/captures/${id}/trend?channel=0&fromS=0.15&toS=0.35`)).body;
    expect(zoomed.points.every((p: { tS: number }) => p.tS >= 0.15 && p.tS <= 0.35)).toBe(true);
    expect(zoomed.total).toBeGreaterThanOrEqual(19); // 0.2 s of half cycles 10 ms apart
    expect(Math.min(...zoomed.points.map((p: { value: number }) => p.value))).toBeCloseTo(0.72 * 231, 0);
    expect((await viewer.get(`/api/captures/${id}/trend?channel=0&kind=nonsense`)).status).toBe(400);
    expect((await viewer.get(`/api/captures/${id}/trend?channel=9`)).status).toBe(404);
  });
});

describe('PUT /api/captures/:id/systems and the declared voltage', () => {
  it('a user restates the set (here as delta, currents left out): 202, then analysed that way', async () => {
    const res = await eng.put(`/api/captures/${id}/systems`).send([{ voltageChannels: [0, 1, 2], connection: 'delta' }]);
    expect(res.status).toBe(202);
    expect(res.body.systemsSpec).toEqual([{ voltageChannels: [0, 1, 2], connection: 'delta' }]);
    await settled(id);
    const [s] = (await eng.get(`/api/captures/${id}/analysis`)).body.systems;
    expect(s).toMatchObject({ connection: 'delta', detectedBy: 'user', currentChannels: null, power: null });
  });

  it('refuses what cannot be a set, naming the field; a viewer gets 403', async () => {
    const current = await eng.put(`/api/captures/${id}/systems`).send([{ voltageChannels: [0, 1, 3], connection: 'wye' }]);
    expect(current.status).toBe(400);
    expect(current.body.error.message).toMatch(/^0\.voltageChannels: channel 3 is not a voltage/);
    const twice = await eng.put(`/api/captures/${id}/systems`).send([{ voltageChannels: [0, 1, 1], connection: 'wye' }]);
    expect(twice.status).toBe(400);
    expect(twice.body.error.message).toMatch(/voltageChannels/);
    expect((await eng.put(`/api/captures/${id}/systems`).send([{ voltageChannels: [0, 1, 2], connection: 'star' }])).status).toBe(400);
    expect((await viewer.put(`/api/captures/${id}/systems`).send([])).status).toBe(403);
  });

  it('DELETE goes back to finding the sets automatically', async () => {
    expect((await eng.delete(`/api/captures/${id}/systems`)).status).toBe(202);
    await settled(id);
    const [s] = (await eng.get(`/api/captures/${id}/analysis`)).body.systems;
    expect(s).toMatchObject({ connection: 'wye', detectedBy: 'names', currentChannels: [3, 4, 5] });
  });

  it('a declared voltage of the capture replaces the suggestion', async () => {
    expect((await eng.put(`/api/captures/${id}/declared-voltage`).send({ declaredVoltage: 240 })).status).toBe(202);
    await settled(id);
    const { voltageEvents } = (await eng.get(`/api/captures/${id}/analysis`)).body;
    expect(voltageEvents[0]).toMatchObject({ declaredVoltage: 240, declaredFrom: 'capture' });
    expect((await eng.put(`/api/captures/${id}/declared-voltage`).send({ declaredVoltage: -5 })).status).toBe(400);
  });

  it('a project’s declared voltage applies to its captures without one of their own', async () => {
    const projectId = (await eng.post('/api/projects').send({ name: 'Plant room' })).body.project.id;
    const patched = await eng.patch(`/api/projects/${projectId}`).send({ declaredVoltage: 220 });
    expect(patched.body.project.declaredVoltage).toBe(220);
    const up = await uploadText(eng, 'again.csv', readFileSync(`fixtures/waveforms/${file}`), { projectId });
    await waitSettled(eng, up.body.id);
    const { voltageEvents } = (await eng.get(`/api/captures/${up.body.id}/analysis`)).body;
    expect(voltageEvents[0]).toMatchObject({ declaredVoltage: 220, declaredFrom: 'project' });
  });
});
