import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { sineCsv, uploadText, waitSettled } from '../helpers/captures';
import { ADMIN, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

let app: RunningServer;
let agent: Awaited<ReturnType<typeof signedIn>>;

beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1', SPAN_FIGURES_MAX_SAMPLES: '5000' });
  await resetDatabase(app);
  agent = await signedIn(app, ADMIN.email, ADMIN.password);
});
afterAll(() => app.stop());

/** A 50 Hz sine of 325 V peak at 10 kS/s for 1 s, with the samples of [0.40 s, 0.45 s) left empty. */
function sineWithGap(): string {
  return sineCsv(325, 50, 10_000, 1)
    .split('\n')
    .map((line, i) => {
      const row = i - 1;
      return row >= 4000 && row < 4500 ? `${line.split(',')[0]},` : line;
    })
    .join('\n');
}

describe('GET /api/captures/:id/figures', () => {
  it('gives the engine figures of a span, computed on the server from the stored samples', async () => {
    const id = (await uploadText(agent, 'span.csv', sineWithGap())).body.id;
    expect((await waitSettled(agent, id)).status).toBe('ready');
    const res = await agent.get(`/api/captures/${id}/figures?fromS=0.1&toS=0.3`);
    expect(res.status).toBe(200);
    expect(res.body.sampleCount).toBe(2000);
    const a = res.body.channels[0].analysis;
    // a sine's RMS is its peak over √2 (standard calculus); the stored samples are Float32 (7 digits)
    expect(a.acRms / (325 / Math.SQRT2)).toBeCloseTo(1, 5);
    expect(a.frequency).toBeCloseTo(50, 3);
    expect(a.window.cycles).toBe(10);
  });

  it('refuses to splice across invalid samples, and says why', async () => {
    const [capture] = (await agent.get('/api/captures')).body.items;
    const res = await agent.get(`/api/captures/${capture.id}/figures?fromS=0.38&toS=0.47`);
    expect(res.status).toBe(200);
    expect(res.body.channels[0].analysis).toBeNull();
    expect(res.body.channels[0].reason).toMatch(/longest valid stretch/);
  });

  it('refuses a span over SPAN_FIGURES_MAX_SAMPLES, naming the limit', async () => {
    const [capture] = (await agent.get('/api/captures')).body.items;
    const res = await agent.get(`/api/captures/${capture.id}/figures?fromS=0&toS=1`);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('span_too_long');
    expect(res.body.error.message).toMatch(/at most 5,000 \(SPAN_FIGURES_MAX_SAMPLES\)/);
  });
});
