import { readFileSync } from 'node:fs';
import { sql } from 'drizzle-orm';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { sineCsv, uploadText, waitSettled } from '../helpers/captures';
import { resetDatabase, signedIn, startTestServer, userAgent } from '../helpers/testServer';

let app: RunningServer;
let eng: Awaited<ReturnType<typeof signedIn>>;
let other: Awaited<ReturnType<typeof signedIn>>;
let viewer: Awaited<ReturnType<typeof signedIn>>;
let projectId: number;

const storedSamples = async (captureId: number) => {
  const [rows] = (await app.ctx.db.execute(sql`SELECT COUNT(*) AS n FROM sample_chunks WHERE capture_id = ${captureId}`)) as unknown as [{ n: number }[]];
  return Number(rows[0].n);
};

beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1' });
  await resetDatabase(app);
  eng = await userAgent(app, { email: 'eng@cap.example', name: 'Eng', role: 'engineer' });
  other = await userAgent(app, { email: 'eng2@cap.example', name: 'Other', role: 'engineer' });
  viewer = await userAgent(app, { email: 'view@cap.example', name: 'View', role: 'viewer' });
  projectId = (await eng.post('/api/projects').send({ name: 'Ingest tests' })).body.project.id;
});
afterAll(() => app.stop());

describe('uploading a capture', () => {
  let id: number;

  it('answers 202 at once, then the capture becomes ready with its analysis', async () => {
    // 230 V RMS mains: peak 230·√2 (common practice, no source)
    const res = await uploadText(eng, 'mains.csv', sineCsv(230 * Math.SQRT2, 50, 10000, 0.2), { projectId, name: 'Mains L1' });
    expect(res.status).toBe(202);
    expect(res.body).toMatchObject({ status: 'queued', duplicate: false });
    id = res.body.id;
    const c = await waitSettled(eng, id);
    expect(c.status).toBe('ready');
    expect(c).toMatchObject({ name: 'Mains L1', projectId, sampleRate: 10000, sampleCount: 2000, error: null });
    expect(c.channels).toEqual([{ index: 0, name: 'CH1', unit: 'V', invalidCount: 0 }]);
    expect(c.detected).toMatchObject({ delimiter: ',', decimal: '.', timeSource: 'column', headerLine: 1, dataStartLine: 2 });
    const a = await eng.get(`/api/captures/${id}/analysis`);
    expect(a.status).toBe(200);
    expect(a.body.channels[0].rms).toBeCloseTo(230, 6);
    expect(a.body.channels[0].frequency).toBeCloseTo(50, 4);
    expect(a.body.channels[0].window.cycles).toBe(10);
    expect(c.keyFigures.rms).toBeCloseTo(230, 6);
  });

  it('recognises a second upload of the same file to the project as the existing capture', async () => {
    const res = await uploadText(other, 'copy-of-mains.csv', sineCsv(230 * Math.SQRT2, 50, 10000, 0.2), { projectId });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ id, status: 'ready', duplicate: true });
  });

  it('serves the samples of a span, or min/max buckets when the span holds more than asked', async () => {
    const raw = await eng.get(`/api/captures/${id}/samples?channel=0&fromS=0&toS=0.001&points=100`);
    expect(raw.status).toBe(200);
    expect(raw.body.mode).toBe('raw');
    expect(raw.body.values.length).toBe(11);
    expect(raw.body.values[5]).toBeCloseTo(230 * Math.SQRT2 * Math.sin(2 * Math.PI * 50 * 0.0005), 3);
    const mm = await eng.get(`/api/captures/${id}/samples?channel=0&points=50`);
    expect(mm.body.mode).toBe('minmax');
    expect(mm.body.max.length).toBeLessThanOrEqual(50);
    expect(Math.max(...mm.body.max)).toBeCloseTo(325.27, 1);
    expect(Math.min(...mm.body.min)).toBeCloseTo(-325.27, 1);
    expect((await eng.get(`/api/captures/${id}/samples?channel=3`)).status).toBe(404);
  });

  it('gives the original file back, byte for byte', async () => {
    const res = await eng.get(`/api/captures/${id}/original`);
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toMatch(/mains\.csv/);
    expect(res.text).toBe(sineCsv(230 * Math.SQRT2, 50, 10000, 0.2));
  });

  it('lists captures by project, status and text', async () => {
    const list = await viewer.get(`/api/captures?projectId=${projectId}&status=ready&q=Mains`);
    expect(list.status).toBe(200);
    expect(list.body.items.map((c: { id: number }) => c.id)).toEqual([id]);
    expect(list.body.total).toBe(1);
    expect((await viewer.get(`/api/captures?projectId=${projectId}&status=failed`)).body.items).toEqual([]);
  });

  it('the demo captures can be added to an empty project, once', async () => {
    const empty = (await eng.post('/api/projects').send({ name: 'Demo playground' })).body.project.id;
    const first = await eng.post(`/api/projects/${empty}/demo-captures`);
    expect(first.status).toBe(202);
    expect(first.body.added).toBe(9);
    expect((await eng.post(`/api/projects/${empty}/demo-captures`)).body.added).toBe(0);
    expect((await viewer.post(`/api/projects/${empty}/demo-captures`)).status).toBe(403);
    const list = (await eng.get(`/api/captures?projectId=${empty}&tag=inverter`)).body.items as { name: string }[];
    expect(list.length).toBe(2);
  });

  it('without projectId, files it under the uploader’s default project', async () => {
    const res = await uploadText(eng, 'loose.csv', sineCsv(10, 60, 6000, 0.1));
    const c = await waitSettled(eng, res.body.id);
    expect(c.projectId).not.toBe(projectId);
    const projects = (await eng.get('/api/projects')).body.items as { id: number; name: string }[];
    expect(projects.find((p) => p.id === c.projectId)?.name).toMatch(/Eng's captures/);
  });
});

describe('bad input', () => {
  it('a file with a non-numeric cell fails with its line, and stores no samples', async () => {
    const res = await uploadText(eng, 'bad.csv', readFileSync('fixtures/bad/non-numeric-cell.csv'), { projectId });
    const c = await waitSettled(eng, res.body.id);
    expect(c.status).toBe('failed');
    expect(c.error).toMatchObject({ code: 'invalid_csv', line: 3 });
    expect(c.error.message).toMatch(/not a number/);
    expect(await storedSamples(c.id)).toBe(0);
    const a = await eng.get(`/api/captures/${c.id}/analysis`);
    expect(a.status).toBe(409);
  });

  it('a channel too broken to analyse fails the capture once it is read, and leaves none of its samples stored', async () => {
    // The samples of an ingest are stored while its channels are analysed: a failed analysis must take them back.
    const rows = ['Time (s),CH1 (V),CH2 (A)'];
    for (let i = 0; i < 4000; i++) rows.push(`${(i / 10000).toFixed(5)},${Math.sin((2 * Math.PI * 50 * i) / 10000).toFixed(5)},${i % 2 ? '' : '0.5'}`);
    const res = await uploadText(eng, 'half-empty.csv', rows.join('\n'), { projectId });
    const c = await waitSettled(eng, res.body.id);
    expect(c.status).toBe('failed');
    expect(c.error.message).toMatch(/CH2.*empty or overrange/);
    expect(await storedSamples(c.id)).toBe(0);
  });

  it('a file without a time base asks for the sample rate, then processes with it', async () => {
    const res = await uploadText(eng, 'logger.csv', 'CH1\n1\n2\n1\n0\n1\n2\n1\n0\n', { projectId });
    const failed = await waitSettled(eng, res.body.id);
    expect(failed.error.code).toBe('needs_sample_rate');
    const retry = await eng.post(`/api/captures/${failed.id}/sample-rate`).send({ sampleRate: 400 });
    expect(retry.status).toBe(202);
    const ready = await waitSettled(eng, failed.id);
    expect(ready.status).toBe('ready');
    expect(ready.sampleRate).toBe(400);
  });

  it('a request without a file is a 400', async () => {
    const res = await eng.post('/api/captures').field('name', 'nothing');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('no_file');
  });
});

describe('who may do what', () => {
  it('a viewer may read but not upload (403); no session is a 401', async () => {
    expect((await uploadText(viewer, 'v.csv', sineCsv(1, 50, 1000, 0.1))).status).toBe(403);
    expect((await supertest(app.server).post('/api/captures').attach('file', Buffer.from('a,b\n1,2\n'), 'x.csv')).status).toBe(401);
    expect((await supertest(app.server).get('/api/captures')).status).toBe(401);
  });

  it('only the uploader or an admin deletes a capture', async () => {
    const res = await uploadText(eng, 'to-delete.csv', sineCsv(5, 50, 5000, 0.1), { projectId });
    await waitSettled(eng, res.body.id);
    expect((await other.delete(`/api/captures/${res.body.id}`)).status).toBe(403);
    expect((await eng.delete(`/api/captures/${res.body.id}`)).status).toBe(204);
    expect((await eng.get(`/api/captures/${res.body.id}`)).status).toBe(404);
    expect(await storedSamples(res.body.id)).toBe(0);
  });
});
