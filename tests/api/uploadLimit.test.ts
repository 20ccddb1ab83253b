import { readdirSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { sineCsv, uploadText } from '../helpers/captures';
import { ADMIN, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

let app: RunningServer;
beforeAll(async () => {
  app = await startTestServer({ UPLOAD_LIMIT_BYTES: String(64 * 1024) });
  await resetDatabase(app);
});
afterAll(() => app.stop());

describe('upload size limit', () => {
  it('a file over the limit is refused with 413 and a clear message, and nothing is kept', async () => {
    const admin = await signedIn(app, ADMIN.email, ADMIN.password);
    const res = await uploadText(admin, 'big.csv', sineCsv(1, 50, 50000, 0.2));
    expect(res.status).toBe(413);
    expect(res.body.error).toEqual({ code: 'too_large', message: 'The file is larger than the upload limit of 64 KiB' });
    expect((await admin.get('/api/captures')).body.total).toBe(0);
    expect(readdirSync(path.join(app.ctx.config.DATA_DIR, 'uploads'))).toEqual([]);
  });
});
