import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { jobs } from '../../server/db/schema';
import { CaptureProcessor } from '../../server/jobs/captureProcessor';
import type { ClaimedJob } from '../../server/jobs/jobQueue';
import { storeFailure, storeSamples } from '../../server/jobs/storeOutcome';
import type { RunningServer } from '../../server/server';
import { sineCsv, uploadText, waitSettled } from '../helpers/captures';
import { ADMIN, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

/** The server answers uploads but runs no worker of its own: each test starts the consumers it needs. */
let app: RunningServer;
let eng: Awaited<ReturnType<typeof signedIn>>;
beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '0', JOB_STALE_SECONDS: '2' });
  await resetDatabase(app);
  const admin = await signedIn(app, ADMIN.email, ADMIN.password);
  await admin.post('/api/users').send({ email: 'q@queue.example', name: 'Queue', role: 'engineer', password: 'engineer-pass-1' });
  eng = await signedIn(app, 'q@queue.example', 'engineer-pass-1');
});
afterAll(() => app.stop());

const jobRows = (captureId: number) => app.ctx.db.select().from(jobs).where(eq(jobs.captureId, captureId));

describe('the capture queue', () => {
  it('twenty uploads at once are all accepted, each with one queued job', async () => {
    const res = await Promise.all(Array.from({ length: 20 }, (_, i) => uploadText(eng, `burst-${i}.csv`, sineCsv(100 + i, 50, 5000, 0.05))));
    for (const r of res) expect(r.status, JSON.stringify(r.body)).toBe(202);
    for (const r of res) expect(await jobRows(r.body.id)).toHaveLength(1);
  });

  it('two consumers on one database process 20 captures exactly once', async () => {
    const ids: number[] = [];
    for (let i = 0; i < 20; i++) ids.push((await uploadText(eng, `c${i}.csv`, sineCsv(1 + i, 50, 5000, 0.1))).body.id);
    const a = new CaptureProcessor(app.ctx);
    const b = new CaptureProcessor(app.ctx);
    a.start();
    b.start();
    try {
      for (const id of ids) expect((await waitSettled(eng, id)).status).toBe('ready');
    } finally {
      await Promise.all([a.stop(), b.stop()]);
    }
    for (const [i, id] of ids.entries()) {
      const rows = await jobRows(id);
      expect(rows).toHaveLength(1);
      expect(rows[0], String(rows[0].lastError)).toMatchObject({ status: 'done', attempts: 1 });
      const analysis = (await eng.get(`/api/captures/${id}/analysis`)).body;
      expect(analysis.channels).toHaveLength(1);
      // a sine's RMS is its peak over √2 (standard calculus)
      expect(analysis.channels[0].acRms).toBeCloseTo((1 + i) / Math.SQRT2, 6);
    }
    // One owner per process: a claim's mark is the process's worker id and a nonce of the claim.
    const owners = new Set((await app.ctx.db.select({ by: jobs.lockedBy }).from(jobs)).map((r) => r.by?.split('/')[0]));
    expect(owners.size).toBe(2);
  });

  it('a job whose worker was stopped mid-analysis completes after a restart, once', async () => {
    // about 1.5 MB: long enough to be caught while processing
    const id = (await uploadText(eng, 'long.csv', sineCsv(100, 50, 100000, 0.6))).body.id;
    const first = new CaptureProcessor(app.ctx);
    first.start();
    for (let i = 0; i < 200 && (await eng.get(`/api/captures/${id}`)).body.status !== 'processing'; i++) await new Promise((r) => setTimeout(r, 10));
    await first.abandon();
    expect((await eng.get(`/api/captures/${id}`)).body.status).toBe('processing');
    expect((await jobRows(id))[0].status).toBe('running');

    const second = new CaptureProcessor(app.ctx);
    second.start();
    try {
      const c = await waitSettled(eng, id, 30_000);
      expect(c.status).toBe('ready');
    } finally {
      await second.stop();
    }
    const [job] = await jobRows(id);
    expect(job).toMatchObject({ status: 'done', attempts: 2 });
    expect(job.lockedBy).toMatch(new RegExp(`^${second.workerId}/[0-9a-f]{8}$`));
    const [rows] = (await app.ctx.db.execute(sql`SELECT COUNT(*) AS n FROM channels WHERE capture_id = ${id}`)) as unknown as [{ n: number }[]];
    expect(Number(rows[0].n)).toBe(1);
  });

  it('a job claimed again, even by the same process, belongs to the new claim alone: the old one stores nothing', async () => {
    const id = (await uploadText(eng, 'claimed-twice.csv', sineCsv(3, 50, 2000, 0.05))).body.id;
    const [row] = await jobRows(id);
    const first: ClaimedJob = { id: row.id, captureId: id, kind: 'ingest', attempts: 1, owner: 'one-process/00000001' };
    // The first claim's heartbeat lapsed (a database outage, say) and the same process claimed the job again.
    await app.ctx.db.update(jobs).set({ status: 'running', lockedBy: 'one-process/00000002', attempts: 2, heartbeatAt: sql`NOW()` }).where(eq(jobs.id, row.id));
    await expect(storeSamples(app.ctx.db, first, [[new Uint8Array(8)]])).rejects.toThrow(/taken over/);
    await storeFailure(app.ctx.db, first, { code: 'internal', message: 'the first claim gave up' });
    expect((await jobRows(id))[0]).toMatchObject({ status: 'running', lockedBy: 'one-process/00000002', attempts: 2 });
    const [chunks] = (await app.ctx.db.execute(sql`SELECT COUNT(*) AS n FROM sample_chunks WHERE capture_id = ${id}`)) as unknown as [{ n: number }[]];
    expect(Number(chunks[0].n)).toBe(0);
    expect((await eng.get(`/api/captures/${id}`)).body.status).not.toBe('failed');
    await app.ctx.db.update(jobs).set({ status: 'done' }).where(eq(jobs.id, row.id));
  });
});
