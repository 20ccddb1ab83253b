import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { inArray } from 'drizzle-orm';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { jobs } from '../../server/db/schema';
import type { RunningServer } from '../../server/server';
import { sineCsv, uploadText, waitSettled } from '../helpers/captures';
import { serverProcess, type ServerProcess } from '../helpers/serverProcess';
import { ADMIN, resetDatabase, startTestServer } from '../helpers/testServer';

/**
 * The README's "Running on more than one machine", run on one: two API processes (no worker) and one
 * worker-only process (no HTTP), each with its own data folder, sharing the database and the folder
 * of kept originals (FILES_DIR). Every capture uploaded through either API is processed exactly once.
 */
let app: RunningServer;
const processes: ServerProcess[] = [];

beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '0' });
  await resetDatabase(app);
});
afterAll(async () => {
  await Promise.all(processes.map((p) => p.stop()));
  await app.stop();
});

const folder = (name: string) => mkdtempSync(path.join(tmpdir(), `crestline-${name}-`));

describe('several processes on one database', () => {
  it('two stateless API processes and one worker-only process: each capture is processed exactly once', async () => {
    const shared = { FILES_DIR: folder('files'), SESSION_SECRET: 'one-secret-shared-by-every-process-of-this-crestline' };
    const [apiA, apiB] = await Promise.all([
      serverProcess(folder('api-a'), { ...shared, RUN_WORKER: '0' }),
      serverProcess(folder('api-b'), { ...shared, RUN_WORKER: '0' }),
    ]);
    processes.push(apiA, apiB);
    const worker = await serverProcess(folder('worker'), { ...shared, RUN_HTTP: '0', RUN_WORKER: '1' });
    processes.push(worker);
    expect(worker.url).toBe('');

    // One sign-in serves both API processes: the session lives in MariaDB, the key is shared.
    const a = supertest.agent(apiA.url).set('X-Crestline-Client', '1');
    expect((await a.post('/api/auth/login').send(ADMIN)).status).toBe(200);
    const cookie = (await a.get('/api/auth/me')).request.cookies;
    const b = supertest.agent(apiB.url).set('X-Crestline-Client', '1').set('Cookie', cookie);
    expect((await b.get('/api/auth/me')).status).toBe(200);

    const ids: number[] = [];
    for (let i = 0; i < 8; i++) {
      const through = i % 2 === 0 ? a : b;
      const res = await uploadText(through, `p${i}.csv`, sineCsv(10 + i, 50, 5000, 0.2));
      expect(res.status).toBe(202);
      ids.push(res.body.id);
    }
    for (const [i, id] of ids.entries()) {
      const c = await waitSettled(i % 2 === 0 ? b : a, id, 60_000);
      expect(c.status).toBe('ready');
    }
    const rows = await app.ctx.db.select().from(jobs).where(inArray(jobs.captureId, ids));
    expect(rows).toHaveLength(ids.length);
    for (const job of rows) expect(job).toMatchObject({ status: 'done', attempts: 1 });
    // Only the worker-only process took jobs: its pid is in every owner's name.
    expect(new Set(rows.map((j) => j.lockedBy?.split(':')[1]))).toEqual(new Set([String(worker.child.pid)]));
    const analysis = await a.get(`/api/captures/${ids[3]}/analysis`);
    // a sine's RMS is its peak over √2 (standard calculus)
    expect(analysis.body.channels[0].acRms).toBeCloseTo(13 / Math.SQRT2, 6);
  }, 120_000);
});
