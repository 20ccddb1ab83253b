/**
 * Simulating a meter's front end on a stored capture: who may, what they send, what comes back.
 * Expected values: 230 V RMS mains peaks at 230·√2 (common practice, no source); an RC averaging
 * converter settles to 1 % in ln(100)·τ (Horowitz & Hill, The Art of Electronics, ch. 1, from memory);
 * the settled reading equals "Your meter"'s for the matching profile (meterModel, tested in the engine).
 */
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { meterInputOf, meterModel, yourMeterProfileOf } from '../../shared/analysis';
import { MAX_SIMULATION_SPAN_SAMPLES, type FrontEndProfile } from '../../shared/schemas/meterSimulation';
import { captures, channels } from '../../server/db/schema';
import type { RunningServer } from '../../server/server';
import { sineCsv, uploadText, waitSettled } from '../helpers/captures';
import { resetDatabase, startTestServer, userAgent } from '../helpers/testServer';

let app: RunningServer;
let eng: Awaited<ReturnType<typeof userAgent>>;
let viewer: Awaited<ReturnType<typeof userAgent>>;
let projectId: number;
let mainsId: number;

const averaging: FrontEndProfile = { type: 'averaging', coupling: 'ac', couplingTauS: 10, averagingTauS: 0.3, displayRateHz: 4, counts: 6000 };
const simulate = (agent: typeof eng, id: number, body: object) => agent.post(`/api/captures/${id}/meter-simulation`).send(body);

beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1' });
  await resetDatabase(app);
  eng = await userAgent(app, { email: 'eng@sim.example', name: 'Eng', role: 'engineer' });
  viewer = await userAgent(app, { email: 'view@sim.example', name: 'View', role: 'viewer' });
  projectId = (await eng.post('/api/projects').send({ name: 'Meter simulations' })).body.project.id;
  const up = await uploadText(eng, 'mains.csv', sineCsv(230 * Math.SQRT2, 50, 10_000, 0.2), { projectId, name: 'Mains L1' });
  mainsId = (await waitSettled(eng, up.body.id)).id;
});
afterAll(() => app.stop());

describe('a viewer simulates a meter on a ready capture', () => {
  it('gets the converter trace, the display, the settled figures and advice; the settled reading is "Your meter"’s', async () => {
    const res = await simulate(viewer, mainsId, { channel: 0, profile: averaging });
    expect(res.status).toBe(200);
    const r = res.body;
    expect(r.trace.length).toBeGreaterThan(100);
    expect(r.trace.length).toBeLessThanOrEqual(2000);
    expect(r.run).toMatchObject({ fromS: 0, start: 'connected', loops: 1, decimation: 1, decimationErrorPercent: null });
    expect(r.run.fundamentalHz).toBeCloseTo(50, 6);
    // Sampled from phase 0 at 200 samples a cycle, mean |sin| is (2/π)·(π/200)·cot(π/200), 8·10⁻⁵ low
    // (a sum of sines, standard calculus); the coupling's small phase shift moves the samples off phase 0.
    expect(Math.abs(r.steadyStateReading / 230 - 1)).toBeLessThan((Math.PI / 200) ** 2 / 3 + 1e-6);
    const analysis = (await viewer.get(`/api/captures/${mainsId}/analysis`)).body.channels[0];
    const predicted = meterModel(yourMeterProfileOf(averaging)!, meterInputOf(analysis)).reading;
    // "Your meter" removes the mean ideally; the coupling capacitor also turns the sine by 1/(ωτc) rad,
    // which moves 200-a-cycle samples of |sin| sampled at phase 0 by about π/(200·ωτc) (derived here).
    expect(Math.abs(r.steadyStateReading / predicted - 1)).toBeLessThan(Math.PI / (200 * 2 * Math.PI * 50 * 10));
    // 0.2 s of record against ln(100)·0.3 s = 1.4 s to settle: not there yet.
    expect(r.settled.settlingTimeS).toBeNull();
    expect(r.advice.kind).toBe('notSettled');
    // Four updates a second: the first comes at 0.25 s, after the record ends.
    expect(r.display).toEqual([]);
    expect(r.notes).toContain('The display first updates 0.25 s after connecting, after this span ends: loop it to see the display.');
  });

  it('looped until settled, the reading is within 1 % after ln(100)·τ, and the display settles on 230.0 V', async () => {
    const tau = 0.3;
    const res = await simulate(viewer, mainsId, { channel: 0, profile: { ...averaging, coupling: 'dc', averagingTauS: tau }, repeat: true });
    expect(res.status).toBe(200);
    const r = res.body;
    expect(r.run.loops).toBeGreaterThan(2);
    // Within one period, plus τ times the ripple's share (the steady output's start value is mean ± ripple/2).
    expect(Math.abs(r.settled.settlingTimeS - Math.log(100) * tau)).toBeLessThan(0.02 + (tau * r.settled.ripplePeakToPeak) / 230);
    expect(r.settled.value).toBe(230);
    expect(r.resolution).toBeCloseTo(0.1, 12);
    // The display samples the rippling output: within half the ripple and a count of the final reading.
    expect(Math.abs(r.display.at(-1).value - 230)).toBeLessThanOrEqual(r.settled.ripplePeakToPeak / 2 + 0.1);
    expect(r.advice.sentence).toMatch(/^Wait 1\.5 s after connecting/);
  });

  it('a span of the capture is simulated from its own start', async () => {
    const res = await simulate(eng, mainsId, { channel: 0, profile: averaging, fromS: 0.05, toS: 0.15, start: 'settled' });
    expect(res.status).toBe(200);
    expect(res.body.run.fromS).toBeCloseTo(0.05, 9);
    expect(res.body.run.toS).toBeCloseTo(0.1501, 9);
    expect(res.body.run.start).toBe('settled');
    expect(res.body.settled.settlingTimeS).toBe(0);
  });
});

describe('what the simulation refuses', () => {
  it('without a session: 401', async () => {
    expect((await supertest(app.server).post(`/api/captures/${mainsId}/meter-simulation`).send({ channel: 0, profile: averaging })).status).toBe(401);
  });

  it('an unknown capture or channel: 404; a capture that is not ready: 409', async () => {
    expect((await simulate(eng, 999_999, { channel: 0, profile: averaging })).status).toBe(404);
    expect((await simulate(eng, mainsId, { channel: 3, profile: averaging })).body.error.code).toBe('not_found');
    const up = await uploadText(eng, 'logger.csv', 'CH1\n1\n2\n1\n0\n', { projectId });
    await waitSettled(eng, up.body.id);
    const res = await simulate(eng, up.body.id, { channel: 0, profile: averaging });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('not_ready');
  });

  it('a time constant outside 1 ms … 10 s, or a field of the wrong kind: 400 naming it', async () => {
    const slow = await simulate(eng, mainsId, { channel: 0, profile: { ...averaging, averagingTauS: 20 } });
    expect(slow.status).toBe(400);
    expect(slow.body.error.message).toMatch(/profile\.averagingTauS: Time constants end at 10 s/);
    const fast = await simulate(eng, mainsId, { channel: 0, profile: { ...averaging, couplingTauS: 1e-4 } });
    expect(fast.body.error.message).toMatch(/profile\.couplingTauS/);
    expect((await simulate(eng, mainsId, { channel: 0, profile: { ...averaging, type: 'thermal' } })).status).toBe(400);
    expect((await simulate(eng, mainsId, { channel: 0, profile: averaging, repeat: 5 })).status).toBe(400);
  });

  it(`a span longer than ${MAX_SIMULATION_SPAN_SAMPLES.toLocaleString('en')} samples: 400 naming the limit; a narrower one passes it`, async () => {
    // A 3 M-sample capture's rows, without its samples: the limit is checked before any are read.
    const [{ id }] = await app.ctx.db
      .insert(captures)
      .values({ projectId, name: 'Long record', status: 'ready', originalName: 'long.csv', sha256: 'f'.repeat(64), sizeBytes: 1, sampleRate: 1e6, sampleCount: 3_000_000, t0: 0 })
      .$returningId();
    await app.ctx.db.insert(channels).values({ captureId: id, idx: 0, name: 'CH1', unit: 'V' });
    const res = await simulate(eng, id, { channel: 0, profile: averaging });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('span_too_long');
    expect(res.body.error.message).toMatch(/3,000,000 samples.*at most 2,000,000 \(MAX_SIMULATION_SPAN_SAMPLES\)/);
    expect((await simulate(eng, id, { channel: 0, profile: averaging, fromS: 0, toS: 1 })).status).toBe(200);
  });

  it('gaps: the longest valid stretch is simulated, and a span made mostly of overrange cells is a 422 with the engine’s reason', async () => {
    // 0.3 s of a 50 Hz sine, then 0.1 s in which four cells of five are overrange.
    const cell = (i: number) => (i < 300 || i % 5 === 0 ? (100 * Math.sin((2 * Math.PI * 50 * i) / 1000)).toFixed(3) : 'OL');
    const rows = ['Time (s),CH1 (V)', ...Array.from({ length: 400 }, (_, i) => `${(i / 1000).toFixed(3)},${cell(i)}`)];
    const up = await uploadText(eng, 'gappy.csv', rows.join('\n') + '\n', { projectId });
    const c = await waitSettled(eng, up.body.id);
    expect(c.error, JSON.stringify(c.error)).toBeNull();
    const whole = await simulate(eng, c.id, { channel: 0, profile: averaging });
    expect(whole.status).toBe(200);
    expect(whole.body.notes[0]).toMatch(/^80 samples of the span are empty or overrange; the meter was run over its longest valid stretch \(301 of 400 samples\)/);
    const res = await simulate(eng, c.id, { channel: 0, profile: averaging, fromS: 0.3, toS: 0.399 });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/longest valid stretch/);
  });
});
