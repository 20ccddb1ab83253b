import { readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { gunzipSync } from 'node:zlib';
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Config } from '../../server/config';
import { captures, channels, jobs } from '../../server/db/schema';
import { CaptureProcessor } from '../../server/jobs/captureProcessor';
import { MAX_ATTEMPTS } from '../../server/jobs/jobQueue';
import type { RunningServer } from '../../server/server';
import { deleteCapture } from '../../server/services/captureService';
import { compressOriginal } from '../../server/services/originalFiles';
import { longTwoChannelCsv, sineCsv, uploadText, waitSettled, waitStatus } from '../helpers/captures';
import { ADMIN, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

/** The server answers uploads but runs no worker of its own: each test starts the processor it needs. */
let app: RunningServer;
let eng: Awaited<ReturnType<typeof signedIn>>;
let admin: Awaited<ReturnType<typeof signedIn>>;
const running: CaptureProcessor[] = [];

beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '0', JOB_STALE_SECONDS: '2' });
  await resetDatabase(app);
  admin = await signedIn(app, ADMIN.email, ADMIN.password);
  await admin.post('/api/users').send({ email: 'h@harden.example', name: 'Hardening', role: 'engineer', password: 'engineer-pass-1' });
  eng = await signedIn(app, 'h@harden.example', 'engineer-pass-1');
});
afterAll(async () => {
  await Promise.all(running.map((p) => p.stop()));
  await app.stop();
});

/** A processor with some settings changed, started; stopped after the file. */
function processor(config: Partial<Config> = {}): CaptureProcessor {
  const p = new CaptureProcessor({ ...app.ctx, config: { ...app.ctx.config, ...config } });
  running.push(p);
  p.start();
  return p;
}

const jobOf = async (captureId: number) => (await app.ctx.db.select().from(jobs).where(eq(jobs.captureId, captureId)))[0];
const dataDir = () => app.ctx.config.DATA_DIR;
const filesOf = (folder: string, captureId?: number) =>
  readdirSync(path.join(dataDir(), folder), { withFileTypes: true })
    .map((d) => d.name)
    .filter((n) => captureId === undefined || n.startsWith(`${captureId}.`));
const channelCount = async (captureId: number) => (await app.ctx.db.select().from(channels).where(eq(channels.captureId, captureId))).length;

// 2,000,000 rows, about 55 MB: reading it takes well over a tenth of a second on any machine we know.
const bigRows = longTwoChannelCsv(2_000_000);
/** The long record with one more row of its own, so that each test's upload is not a duplicate. */
let variant = 0;
const big = () => Buffer.concat([bigRows, Buffer.from(`20.00000,${++variant},0\n`)]);

describe('time budgets', () => {
  it('when a file runs past its time budget, its worker is stopped and the capture fails with "took longer than"', async () => {
    const config: Config = { ...app.ctx.config, INGEST_CONCURRENCY: 1, INGEST_TIME_FLOOR_SECONDS: 0.1, INGEST_SECONDS_PER_MB: 0 };
    const p = new CaptureProcessor({ ...app.ctx, config });
    running.push(p);
    p.start();
    const id = (await uploadText(eng, 'slow.csv', big())).body.id;
    p.nudge();
    const c = await waitSettled(eng, id, 60_000);
    expect(c.status).toBe('failed');
    expect(c.error.code).toBe('timeout');
    expect(c.error.message).toMatch(/took longer than 0\.1 s/);
    expect(await jobOf(id)).toMatchObject({ status: 'failed', attempts: 1 });
    expect(await channelCount(id)).toBe(0);

    // The slot's next file, with an ordinary budget again, gets a fresh worker and is processed as usual.
    config.INGEST_TIME_FLOOR_SECONDS = 60;
    const next = (await uploadText(eng, 'after.csv', sineCsv(10, 50, 5000, 0.2))).body.id;
    p.nudge();
    expect((await waitSettled(eng, next)).status).toBe('ready');
    await p.stop();
  }, 120_000);

  it('while one large file is being read, a small upload is processed beside it', async () => {
    const p = processor({ INGEST_CONCURRENCY: 2 });
    const slow = (await uploadText(eng, 'large.csv', big(), { name: 'large one' })).body.id;
    p.nudge();
    await waitStatus(eng, slow, 'processing');
    const quick = (await uploadText(eng, 'small.csv', sineCsv(5, 50, 5000, 0.2))).body.id;
    p.nudge();
    await waitStatus(eng, quick, 'ready');
    expect((await eng.get(`/api/captures/${slow}`)).body.status).toBe('processing');
    expect((await waitSettled(eng, slow, 60_000)).status).toBe('ready');
    await p.stop();
  }, 120_000);

  it('a stop interrupts a running file and gives its job back uncounted; the next start completes it once', async () => {
    const first = processor();
    const id = (await uploadText(eng, 'interrupted.csv', big(), { name: 'interrupted' })).body.id;
    first.nudge();
    await waitStatus(eng, id, 'processing');
    await first.stop();
    expect(await jobOf(id)).toMatchObject({ status: 'queued', attempts: 0, lockedBy: null });
    expect((await eng.get(`/api/captures/${id}`)).body.status).toBe('queued');

    const second = processor();
    expect((await waitSettled(eng, id, 60_000)).status).toBe('ready');
    expect(await jobOf(id)).toMatchObject({ status: 'done', attempts: 1 });
    expect((await jobOf(id)).lockedBy).toMatch(new RegExp(`^${second.workerId}/`));
    expect(await channelCount(id)).toBe(2);
    await second.stop();
  }, 120_000);
});

describe('attempts and messages', () => {
  it('a job already tried MAX_ATTEMPTS times (its process died each time) fails for good when claimed again', async () => {
    const id = (await uploadText(eng, 'poison.csv', sineCsv(3, 50, 5000, 0.2))).body.id;
    await app.ctx.db
      .update(jobs)
      .set({ status: 'running', attempts: MAX_ATTEMPTS, lockedBy: 'a-process-that-died', heartbeatAt: sql`NOW() - INTERVAL 1 HOUR` })
      .where(eq(jobs.captureId, id));
    const p = processor();
    const c = await waitSettled(eng, id);
    expect(c.status).toBe('failed');
    expect(c.error.message).toMatch(/stopped without finishing several times \(reference \d+-[0-9a-f]{6}\)/);
    expect(await jobOf(id)).toMatchObject({ status: 'failed', attempts: MAX_ATTEMPTS + 1 });
    await p.stop();
  });

  it('an unexpected failure shows users a reference, never the internal error text', async () => {
    const id = (await uploadText(eng, 'vanished.csv', sineCsv(3, 50, 5000, 0.2))).body.id;
    await app.ctx.db.update(captures).set({ originalPath: 'originals/does-not-exist.csv' }).where(eq(captures.id, id));
    const p = processor();
    const c = await waitSettled(eng, id);
    expect(c.status).toBe('failed');
    expect(c.error.code).toBe('internal');
    expect(c.error.message).toMatch(/^Processing failed unexpectedly \(reference \d+-[0-9a-f]{6}\)/);
    expect(c.error.message).not.toMatch(/ENOENT|does-not-exist|originals|SELECT/);
    expect(await jobOf(id)).toMatchObject({ status: 'failed', attempts: MAX_ATTEMPTS });
    const analysis = await eng.get(`/api/captures/${id}/analysis`);
    expect(analysis.body.error.message).not.toMatch(/ENOENT|originals/);
    await p.stop();
  });

  it('a 70,000-character column name ends in a short stored message, and the capture settles as failed', async () => {
    const name = 'N'.repeat(70_000);
    const text = `Time (s),${name} (V)\n0,1\n0.001,2,3\n0.002,3\n`;
    const id = (await uploadText(eng, 'long-name.csv', text)).body.id;
    const p = processor();
    const c = await waitSettled(eng, id);
    expect(c.status).toBe('failed');
    expect(c.error.message.length).toBeLessThanOrEqual(500);
    expect(await jobOf(id)).toMatchObject({ status: 'failed', attempts: 1 });
    await p.stop();
  });
});

/** Rows of a 50 Hz sine at 10 kS/s, time in the first column. */
const sineRows = (n: number) => Array.from({ length: n }, (_, i) => `${(i / 10000).toFixed(4)},${Math.sin((2 * Math.PI * 50 * i) / 10000).toFixed(5)}\n`).join('');

describe('hostile files', () => {
  it('a header cell of a bracket and 8,000 spaces (minutes of backtracking once) ends at once, naming the limit and the line', async () => {
    const p = processor({ INGEST_TIME_FLOOR_SECONDS: 10, INGEST_SECONDS_PER_MB: 0 });
    const tooLong = (await uploadText(eng, 'brackets.csv', `Time (s),CH1 (${' '.repeat(8000)}x\n${sineRows(2000)}`)).body.id;
    // Under the 1 kB title limit the same shape is read as usual: 900 spaces cost seconds of backtracking once.
    const fits = (await uploadText(eng, 'brackets-short.csv', `Time (s),CH1 (${' '.repeat(900)}x\n${sineRows(2000)}`)).body.id;
    p.nudge();
    const c = await waitSettled(eng, tooLong, 20_000);
    expect(c.status).toBe('failed');
    expect(c.error).toMatchObject({ code: 'too_large', line: 1 });
    expect(c.error.message).toMatch(/at most 1,024/);
    expect((await waitSettled(eng, fits, 20_000)).status).toBe('ready');
    await p.stop();
  });

  it('a file over the memory budget of rows × channels fails with the limit named, storing nothing', async () => {
    // 16 MiB at 40 bytes a sample: 419,430 samples; this file has 300,000 rows of 2 channels.
    const p = processor({ INGEST_MEMORY_MB: 16 });
    const id = (await uploadText(eng, 'too-many.csv', longTwoChannelCsv(300_000))).body.id;
    p.nudge();
    const c = await waitSettled(eng, id);
    expect(c.status).toBe('failed');
    expect(c.error.code).toBe('too_large');
    expect(c.error.message).toMatch(/more than 419,430 samples/);
    expect(c.error.line).toBeGreaterThan(200_000);
    expect(await channelCount(id)).toBe(0);
    await p.stop();
  });
});

describe('temporary and kept files', () => {
  it('an upload refused for its form fields leaves no temporary file', async () => {
    const bad = await uploadText(eng, 'fields.csv', sineCsv(1, 50, 5000, 0.1), { sampleRate: -5 });
    expect(bad.status).toBe(400);
    const unknownProject = await uploadText(eng, 'fields.csv', sineCsv(1, 50, 5000, 0.1), { projectId: 987654 });
    expect(unknownProject.status).toBe(404);
    expect(filesOf('uploads')).toEqual([]);
  });

  it('when the database refuses the upload after the original was moved, the original is removed again', async () => {
    const before = filesOf('originals');
    // A real refusal inside the upload's transaction: the queue table rejects the insert.
    await app.ctx.db.execute(sql.raw("CREATE TRIGGER refuse_jobs BEFORE INSERT ON jobs FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'queue refused'"));
    try {
      const res = await uploadText(eng, 'rolled-back.csv', sineCsv(7, 50, 5000, 0.1));
      expect(res.status).toBe(500);
      expect(JSON.stringify(res.body)).not.toMatch(/queue refused|INSERT/);
    } finally {
      await app.ctx.db.execute(sql.raw('DROP TRIGGER refuse_jobs'));
    }
    expect(filesOf('originals')).toEqual(before);
    expect(filesOf('uploads')).toEqual([]);
    expect(await app.ctx.db.select().from(captures).where(eq(captures.originalName, 'rolled-back.csv'))).toEqual([]);
  });
});

describe('re-analysis', () => {
  async function readyCapture(peak: number) {
    const p = processor();
    const id = (await uploadText(eng, `ready-${peak}.csv`, sineCsv(peak, 50, 5000, 0.2))).body.id;
    p.nudge();
    expect((await waitSettled(eng, id)).status).toBe('ready');
    await p.stop();
    await app.ctx.db.update(captures).set({ engineVersion: 0 }).where(eq(captures.id, id));
    return id;
  }

  it('asking twice queues one re-analysis per capture', async () => {
    const id = await readyCapture(11);
    const first = await admin.post('/api/admin/reanalyse');
    const second = await admin.post('/api/admin/reanalyse');
    expect(first.body.queued).toBeGreaterThanOrEqual(1);
    expect(second.body.queued).toBe(0);
    const queued = (await app.ctx.db.select().from(jobs).where(eq(jobs.captureId, id))).filter((j) => j.kind === 'reanalyse');
    expect(queued).toHaveLength(1);
    const p = processor();
    await waitFor(async () => (await app.ctx.db.select().from(jobs).where(eq(jobs.status, 'queued'))).length === 0);
    await p.stop();
  });

  it('a re-analysis that fails keeps the last good results of a ready capture', async () => {
    const id = await readyCapture(12);
    const broken = path.join('originals', `${id}-broken.csv`);
    writeFileSync(path.join(dataDir(), broken), 'this is not\na capture at all\n');
    await app.ctx.db.update(captures).set({ originalPath: broken }).where(eq(captures.id, id));
    await admin.post('/api/admin/reanalyse');
    const p = processor();
    await waitFor(async () => (await jobOfKind(id, 'reanalyse'))?.status === 'failed');
    await p.stop();
    const c = (await eng.get(`/api/captures/${id}`)).body;
    expect(c.status).toBe('ready');
    const analysis = await eng.get(`/api/captures/${id}/analysis`);
    expect(analysis.status).toBe(200);
    // a sine's RMS is its peak over √2 (standard calculus)
    expect(analysis.body.channels[0].acRms).toBeCloseTo(12 / Math.SQRT2, 6);
    expect((await eng.get(`/api/captures/${id}/samples?channel=0&points=100`)).status).toBe(200);
  });
});

describe('compressing originals', () => {
  async function plainOriginal(text: string) {
    const p = processor();
    const id = (await uploadText(eng, `plain-${text.length}.csv`, text)).body.id;
    p.nudge();
    await waitSettled(eng, id);
    await p.stop();
    // Back to a plain original, as just after processing.
    const relative = path.join('originals', `${id}.csv`);
    for (const n of filesOf('originals', id)) rmSync(path.join(dataDir(), 'originals', n));
    writeFileSync(path.join(dataDir(), relative), text);
    await app.ctx.db.update(captures).set({ originalPath: relative }).where(eq(captures.id, id));
    return id;
  }

  it('two compressions of one original at once leave one intact gzip and nothing else', async () => {
    const text = sineCsv(9, 50, 20000, 0.5);
    const id = await plainOriginal(text);
    await Promise.all([compressOriginal(app.ctx, id), compressOriginal(app.ctx, id)]);
    const [row] = await app.ctx.db.select().from(captures).where(eq(captures.id, id));
    expect(row.originalPath).toBe(path.join('originals', `${id}.csv.gz`));
    expect(filesOf('originals', id).filter((n) => n !== `${id}.csv.gz`)).toEqual([]);
    expect(gunzipSync(readFileSync(path.join(dataDir(), row.originalPath!))).toString()).toBe(text);
  });

  it('deleting a capture while its original is being compressed leaves no file behind', async () => {
    const id = await plainOriginal(sineCsv(8, 50, 20000, 0.5));
    const me = (await eng.get('/api/auth/me')).body.user;
    await Promise.all([compressOriginal(app.ctx, id), deleteCapture(app.ctx, me, id)]);
    expect(filesOf('originals', id)).toEqual([]);
  });
});

async function jobOfKind(captureId: number, kind: 'ingest' | 'reanalyse') {
  return (await app.ctx.db.select().from(jobs).where(eq(jobs.captureId, captureId))).find((j) => j.kind === kind);
}

async function waitFor(check: () => Promise<boolean>, timeoutMs = 30_000) {
  const until = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > until) throw new Error('condition not met in time');
    await new Promise((r) => setTimeout(r, 50));
  }
}
