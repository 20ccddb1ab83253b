import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SHARED_MAX_POINTS } from '../../shared/schemas/share';
import type { RunningServer } from '../../server/server';
import { sineCsv, uploadText, waitSettled } from '../helpers/captures';
import { ADMIN, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

let app: RunningServer;
let eng: Awaited<ReturnType<typeof signedIn>>;
let captureId: number;
/** Small limits, and a trusted proxy so that each read can come from the address it names. */
beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1', TRUST_PROXY: '1', SHARE_READS_PER_LINK: '5', SHARE_READS_PER_ADDRESS: '8' });
  await resetDatabase(app);
  eng = await signedIn(app, ADMIN.email, ADMIN.password);
  // 50,000 samples: more than one shared request may carry.
  captureId = (await uploadText(eng, 'long.csv', sineCsv(325, 50, 50_000, 1))).body.id;
  await waitSettled(eng, captureId);
});
afterAll(() => app.stop());

let addresses = 0;
const newAddress = () => `203.0.113.${++addresses}`;
const newLink = async (): Promise<string> => (await eng.post(`/api/captures/${captureId}/shares`).send({})).body.token;
const read = (token: string, from: string, query = 'channel=0&points=100') =>
  supertest(app.server).get(`/api/shared/${token}/captures/${captureId}/samples?${query}`).set('X-Forwarded-For', from);

describe('how much one shared request answers', () => {
  it(`when a reader asks a link for a million points of 50,000 samples, then min/max buckets come back, at most ${SHARED_MAX_POINTS}`, async () => {
    const res = await read(await newLink(), newAddress(), 'channel=0&points=1000000');
    expect(res.status).toBe(200);
    expect(res.body.mode).toBe('minmax');
    expect(res.body.sampleCount).toBe(50_000);
    expect(res.body.min.length).toBeLessThanOrEqual(SHARED_MAX_POINTS);
    expect(res.body.max.length).toBe(res.body.min.length);
  });

  it(`when the span holds at most ${SHARED_MAX_POINTS} samples, then the link answers them raw`, async () => {
    const res = await read(await newLink(), newAddress(), 'channel=0&fromS=0&toS=0.3&points=1000000');
    expect(res.status).toBe(200);
    expect(res.body.mode).toBe('raw');
    expect(res.body.values.length).toBe(res.body.sampleCount);
    expect(res.body.sampleCount).toBeLessThanOrEqual(SHARED_MAX_POINTS);
  });

  it('a signed-in engineer asking the capture itself for a million points still gets every sample', async () => {
    const res = await eng.get(`/api/captures/${captureId}/samples?channel=0&points=1000000`);
    expect(res.body.mode).toBe('raw');
    expect(res.body.values).toHaveLength(50_000);
  });
});

describe('how often a link is answered (5 a minute per link, 8 per address, here)', () => {
  it('when a link is read from many addresses, then the 6th read within the minute is 429 with Retry-After', async () => {
    const link = await newLink();
    for (let i = 0; i < 5; i++) expect((await read(link, newAddress())).status).toBe(200);
    const refused = await read(link, newAddress());
    expect(refused.status).toBe(429);
    expect(refused.body.error.code).toBe('too_many_requests');
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(refused.headers['retry-after'])).toBeLessThanOrEqual(60);
    // The page itself counts against the same link.
    expect((await supertest(app.server).get(`/api/shared/${link}`).set('X-Forwarded-For', newAddress())).status).toBe(429);
  });

  it('when one address reads many links, then its 9th read within the minute is 429', async () => {
    const from = newAddress();
    const links = [await newLink(), await newLink(), await newLink()];
    for (let i = 0; i < 8; i++) expect((await read(links[i % 3], from)).status).toBe(200);
    expect((await read(links[0], from)).status).toBe(429);
    expect((await read(links[0], newAddress())).status).toBe(200);
  });

  it('when ten reads of one link arrive at once, then exactly five are answered', async () => {
    const link = await newLink();
    const from = newAddress();
    const statuses = (await Promise.all(Array.from({ length: 10 }, () => read(link, from)))).map((r) => r.status);
    expect(statuses.filter((s) => s === 200)).toHaveLength(5);
    expect(statuses.filter((s) => s === 429)).toHaveLength(5);
  });

  it('an unknown token is counted too: guessing links is limited per address', async () => {
    const from = newAddress();
    for (let i = 0; i < 8; i++) expect((await read(`guess${String(i).padStart(30, '0')}`, from)).status).toBe(404);
    expect((await read('guess'.padEnd(35, 'x'), from)).status).toBe(429);
  });
});
