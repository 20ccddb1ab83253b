import http from 'node:http';
import { eq } from 'drizzle-orm';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { jobs } from '../../server/db/schema';
import type { EarlyReading } from '../../server/jobs/earlyReading';
import type { RunningServer } from '../../server/server';
import { longTwoChannelCsv, sineCsv, uploadText, waitSettled } from '../helpers/captures';
import { ADMIN, AS_CLIENT, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

/**
 * A CSV is read by a worker while it is still being uploaded, and its capture processed from that
 * reading. What a user gets must not depend on it: the same figures as a reading of the stored file,
 * the same errors, and every slot given back whatever becomes of the upload.
 */
let app: RunningServer;
let eng: Awaited<ReturnType<typeof signedIn>>;
const readings: EarlyReading[] = [];

beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1', INGEST_CONCURRENCY: '2' });
  await resetDatabase(app);
  const admin = await signedIn(app, ADMIN.email, ADMIN.password);
  await admin.post('/api/users').send({ email: 'r@reading.example', name: 'Reader', role: 'engineer', password: 'engineer-pass-1' });
  eng = await signedIn(app, 'r@reading.example', 'engineer-pass-1');
  const readUpload = app.processor.readUpload.bind(app.processor);
  vi.spyOn(app.processor, 'readUpload').mockImplementation((bytes) => {
    const r = readUpload(bytes);
    if (r) readings.push(r);
    return r;
  });
});
afterAll(() => app.stop());

/** Whether a slot can be kept for an upload now (and gives it straight back). */
function slotFree(): boolean {
  const r = app.processor.readUpload(1);
  r?.drop();
  return r !== null;
}

async function untilSlotFree() {
  for (let i = 0; i < 200 && !slotFree(); i++) await new Promise((r) => setTimeout(r, 25));
  expect(slotFree()).toBe(true);
}

describe('reading an upload as it arrives', () => {
  it('processes the capture from the reading, with the figures a reading of the stored file gives', async () => {
    await untilSlotFree();
    readings.length = 0;
    const res = await uploadText(eng, 'mains.csv', longTwoChannelCsv(60_000));
    expect(res.status).toBe(202);
    expect((await waitSettled(eng, res.body.id)).status).toBe('ready');
    expect(readings.map((r) => r.state)).toEqual(['adopted']);
    const [job] = await app.ctx.db.select().from(jobs).where(eq(jobs.captureId, res.body.id));
    expect(job).toMatchObject({ kind: 'ingest', status: 'done', attempts: 1 });
    expect(job.lockedBy).toMatch(new RegExp(`^${app.processor.workerId}/`));
    const early = (await eng.get(`/api/captures/${res.body.id}/analysis`)).body;

    // A change of channel setup re-reads the stored file from disk: the figures must not move.
    await untilSlotFree();
    const setup = await eng.patch(`/api/captures/${res.body.id}/channels/1`).send({ name: 'Line current' });
    expect(setup.status, JSON.stringify(setup.body)).toBeLessThan(300);
    for (let i = 0; i < 200; i++) {
      const rows = await app.ctx.db.select().from(jobs).where(eq(jobs.captureId, res.body.id));
      if (rows.length === 2 && rows.every((r) => r.status === 'done')) break;
      await new Promise((r) => setTimeout(r, 50));
    }
    const fromDisk = (await eng.get(`/api/captures/${res.body.id}/analysis`)).body;
    expect(fromDisk.channels.map((c: { name: string }) => ({ ...c, name: '' }))).toEqual(early.channels.map((c: { name: string }) => ({ ...c, name: '' })));
    // 325 V peak sine: RMS 325/√2 = 229.8 V (standard calculus)
    expect(early.channels[0].acRms).toBeCloseTo(325 / Math.SQRT2, 1);
  });

  it('takes a sample rate sent after the file, for a file without a time base', async () => {
    await untilSlotFree();
    readings.length = 0;
    const rows = Array.from({ length: 20_000 }, (_, i) => (100 * Math.sin((2 * Math.PI * 50 * i) / 10_000)).toFixed(4));
    const res = await eng.post('/api/captures').attach('file', Buffer.from(`CH1 (V)\n${rows.join('\n')}\n`), 'no-time.csv').field('sampleRate', '10000');
    expect(res.status).toBe(202);
    const done = await waitSettled(eng, res.body.id);
    expect(done.status, JSON.stringify(done.error)).toBe('ready');
    expect(done.sampleRate).toBe(10_000);
    expect(readings.map((r) => r.state)).toEqual(['adopted']);
  });

  it('fails a bad file with its line, as from disk, and frees the slot', async () => {
    await untilSlotFree();
    readings.length = 0;
    const lines = sineCsv(10, 50, 10_000, 1).split('\n');
    lines[7001] = '0.7,not-a-number';
    const res = await uploadText(eng, 'bad-line.csv', lines.join('\n'));
    const done = await waitSettled(eng, res.body.id);
    expect(done.status).toBe('failed');
    expect(done.error.line).toBe(7002);
    expect(readings.map((r) => r.state)).toEqual(['adopted']);
    await untilSlotFree();
  });

  it('gives the slot back for a duplicate, and for a refused form', async () => {
    const text = sineCsv(20, 50, 5000, 0.2);
    const first = await uploadText(eng, 'twice.csv', text);
    await waitSettled(eng, first.body.id);
    await untilSlotFree();
    readings.length = 0;
    const again = await uploadText(eng, 'twice.csv', text);
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ id: first.body.id, duplicate: true });
    const refused = await uploadText(eng, 'refused.csv', text + '\n', { projectId: 999_999 });
    expect(refused.status).toBeGreaterThanOrEqual(400);
    expect(readings.map((r) => r.state)).toEqual(['dropped', 'dropped']);
    expect(slotFree()).toBe(true);
  });

  it('gives the slot back when the sender stops halfway', async () => {
    await untilSlotFree();
    readings.length = 0;
    const url = new URL(`http://127.0.0.1:${(app.server.address() as { port: number }).port}/api/captures`);
    const boundary = 'x-crestline-boundary';
    const head = `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="cut.csv"\r\nContent-Type: text/csv\r\n\r\n`;
    const login = await supertest(app.server).post('/api/auth/login').set(AS_CLIENT).send({ email: 'r@reading.example', password: 'engineer-pass-1' });
    const cookie = login.headers['set-cookie'][0].split(';')[0];
    await new Promise<void>((resolve) => {
      const req = http.request(url, { method: 'POST', headers: { ...AS_CLIENT, cookie, 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': String(10_000_000) } });
      req.on('error', () => resolve());
      req.write(head + sineCsv(5, 50, 10_000, 1));
      setTimeout(() => {
        req.destroy();
        resolve();
      }, 300);
    });
    for (let i = 0; i < 100 && readings.some((r) => r.state !== 'dropped'); i++) await new Promise((r) => setTimeout(r, 20));
    expect(readings.map((r) => r.state)).toEqual(['dropped']);
    await untilSlotFree();
  });

  it('lets the capture be renamed, then deleted, while its samples are being stored', async () => {
    await untilSlotFree();
    const res = await uploadText(eng, 'renamed-then-deleted.csv', longTwoChannelCsv(300_000));
    expect(res.status).toBe(202);
    const statuses: number[] = [];
    for (let i = 0; i < 8; i++) {
      statuses.push((await eng.patch(`/api/captures/${res.body.id}`).send({ name: `Run ${i}` })).status);
      await new Promise((r) => setTimeout(r, 25));
    }
    statuses.push((await eng.delete(`/api/captures/${res.body.id}`)).status);
    // Never a 500 (a deadlock with the run's store): each change waits for it or comes before it.
    expect(statuses).toEqual([200, 200, 200, 200, 200, 200, 200, 200, 204]);
    expect((await eng.get(`/api/captures/${res.body.id}`)).status).toBe(404);
    await untilSlotFree();
  });

  it('keeps one slot for the queue: only one upload at a time is read as it arrives', async () => {
    await untilSlotFree();
    const a = app.processor.readUpload(1);
    const b = app.processor.readUpload(1);
    expect(a).not.toBeNull();
    expect(b).toBeNull();
    a!.drop();
  });
});
