import { execFileSync } from 'node:child_process';
import supertest from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { startTestServer } from '../helpers/testServer';

/** A throwaway MariaDB instance that this test stops under a running server. */
const instance = 'health-probe';
let app: RunningServer | undefined;
afterAll(async () => {
  await app?.stop().catch(() => undefined);
  execFileSync('scripts/db.sh', ['down', instance]);
});

describe('GET /api/health', () => {
  it('answers ok while the database is up and 503 once it is stopped', async () => {
    const url = execFileSync('scripts/db.sh', ['up', instance, process.env.HEALTH_DB_PORT ?? '3408', 'crestline_health']).toString().trim();
    app = await startTestServer({ DATABASE_URL: url });
    const up = await supertest(app.server).get('/api/health');
    expect(up.status).toBe(200);
    expect(up.body).toEqual({ status: 'ok', db: 'ok' });

    execFileSync('scripts/db.sh', ['down', instance]);
    const down = await supertest(app.server).get('/api/health');
    expect(down.status).toBe(503);
    expect(down.body.db).not.toBe('ok');
  });
});
