import { execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { channels, jobs } from '../../server/db/schema';
import { CaptureProcessor } from '../../server/jobs/captureProcessor';
import type { RunningServer } from '../../server/server';
import { longTwoChannelCsv, sineCsv, uploadText, waitSettled, waitStatus } from '../helpers/captures';
import { serverProcess as startServerProcess } from '../helpers/serverProcess';
import { ADMIN, resetDatabase, signedIn, startTestServer, testDatabaseUrl } from '../helpers/testServer';

/**
 * Faults a team's server meets in real life: a process killed mid-ingest, the database stopped under
 * an upload, a worker thread that dies. Each must end with every capture processed exactly once.
 */
let app: RunningServer;
const cleanups: (() => Promise<unknown> | unknown)[] = [];

beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '0', JOB_STALE_SECONDS: '1' });
  await resetDatabase(app);
});
afterAll(async () => {
  for (const c of cleanups.reverse()) await Promise.resolve(c()).catch(() => undefined);
  await app.stop();
});

const rows = longTwoChannelCsv(1_500_000);
let variant = 0;
/** The long record with a row of its own, so that no upload is taken for a duplicate of another. */
const longRecord = () => Buffer.concat([rows, Buffer.from(`15.00000,${++variant},0\n`)]);

async function jobOf(captureId: number) {
  return (await app.ctx.db.select().from(jobs).where(eq(jobs.captureId, captureId)))[0];
}
async function channelCount(captureId: number) {
  return (await app.ctx.db.select().from(channels).where(eq(channels.captureId, captureId))).length;
}

/** A server process of its own, killed at the end of the file whatever happens. */
async function serverProcess(dataDir: string) {
  const p = await startServerProcess(dataDir);
  cleanups.push(() => p.child.exitCode === null && p.child.kill('SIGKILL'));
  return p;
}

async function signedInAt(url: string) {
  const agent = supertest.agent(url);
  agent.set('X-Crestline-Client', '1');
  const res = await agent.post('/api/auth/login').send(ADMIN);
  expect(res.status).toBe(200);
  return agent;
}

describe('fault: the server process is killed mid-ingest', () => {
  it('after SIGKILL and a new start, the capture completes exactly once', async () => {
    const dataDir = mkdtempSync(path.join(tmpdir(), 'crestline-fault-'));
    const first = await serverProcess(dataDir);
    const agent = await signedInAt(first.url);
    const id = (await uploadText(agent, 'killed.csv', longRecord())).body.id;
    await waitStatus(agent, id, 'processing');
    first.child.kill('SIGKILL');
    await new Promise((r) => first.child.once('exit', r));
    expect((await jobOf(id)).status).toBe('running');

    const second = await serverProcess(dataDir);
    const again = await signedInAt(second.url);
    expect((await waitSettled(again, id, 60_000)).status).toBe('ready');
    expect(await jobOf(id)).toMatchObject({ status: 'done', attempts: 2 });
    expect(await channelCount(id)).toBe(2);
    second.child.kill('SIGTERM');
    await new Promise((r) => second.child.once('exit', r));
  }, 120_000);
});

describe('fault: a worker thread dies', () => {
  it('the job is tried again and the capture completes once', async () => {
    const eng = await signedIn(app, ADMIN.email, ADMIN.password);
    const p = new CaptureProcessor(app.ctx);
    cleanups.push(() => p.stop());
    p.start();
    const id = (await uploadText(eng, 'worker-dies.csv', longRecord())).body.id;
    p.nudge();
    await waitStatus(eng, id, 'processing');
    // Once the file is in a worker thread (the status turns to processing a moment before), every worker
    // thread of the processor goes, as after a crash inside one.
    while (!p.slots.some((slot) => slot.tasksInFlight > 0)) await new Promise((r) => setTimeout(r, 2));
    await Promise.all(p.slots.map((slot) => slot.close()));
    expect((await waitSettled(eng, id, 60_000)).status).toBe('ready');
    expect(await jobOf(id)).toMatchObject({ status: 'done', attempts: 2 });
    expect(await channelCount(id)).toBe(2);
  }, 120_000);
});

describe('fault: the database stops during an upload', () => {
  const instance = 'fault-probe';
  it('the upload is answered 503 and leaves nothing behind; a retry once it is back succeeds', async () => {
    // A throwaway MariaDB instance of its own, beside the test database.
    const port = String(Number(new URL(testDatabaseUrl()).port) + 13);
    const url = execFileSync('scripts/db.sh', ['up', instance, port, 'crestline_fault']).toString().trim();
    cleanups.push(() => execFileSync('scripts/db.sh', ['down', instance]));
    const own = await startTestServer({ DATABASE_URL: url, RUN_WORKER: '1' });
    cleanups.push(() => own.stop());
    await resetDatabase(own);
    const agent = await signedIn(own, ADMIN.email, ADMIN.password);
    const text = sineCsv(230 * Math.SQRT2, 50, 10_000, 0.2);

    execFileSync('scripts/db.sh', ['down', instance]);
    const refused = await uploadText(agent, 'during-outage.csv', text);
    expect(refused.status).toBe(503);
    expect(refused.body.error.code).toBe('unavailable');
    expect(readdirSync(path.join(own.ctx.config.DATA_DIR, 'uploads'))).toEqual([]);

    execFileSync('scripts/db.sh', ['up', instance, port, 'crestline_fault']);
    const retried = await uploadText(agent, 'during-outage.csv', text);
    expect(retried.status).toBe(202);
    const capture = await waitSettled(agent, retried.body.id);
    expect(capture.status).toBe('ready');
    expect((await agent.get('/api/captures')).body.total).toBe(1);
  }, 120_000);
});
