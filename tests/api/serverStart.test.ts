import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, statSync, writeFileSync, existsSync } from 'node:fs';
import { createServer, type Server } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { processStart } from '../../server/services/dataDirLock';
import { StartupError } from '../../server/startupError';
import { startTestServer } from '../helpers/testServer';

const running: RunningServer[] = [];
const blockers: Server[] = [];
afterEach(async () => {
  for (const app of running.splice(0)) await app.stop();
  for (const b of blockers.splice(0)) await new Promise((r) => b.close(r));
});

const freshDir = () => mkdtempSync(path.join(tmpdir(), 'crestline-start-'));
const start = async (overrides: Parameters<typeof startTestServer>[0]) => {
  const app = await startTestServer(overrides);
  running.push(app);
  return app;
};
/** A port some other program holds. */
async function takenPort(): Promise<number> {
  const blocker = createServer();
  blockers.push(blocker);
  await new Promise<void>((resolve) => blocker.listen(0, '127.0.0.1', resolve));
  return (blocker.address() as { port: number }).port;
}
const mode = (file: string) => (statSync(file).mode & 0o777).toString(8);

describe('starting the server', () => {
  it('refuses a taken HTTP port with one line naming PORT, and releases the data folder', async () => {
    const port = await takenPort();
    const dir = freshDir();
    const failure = await startTestServer({ PORT: String(port), DATA_DIR: dir }).catch((e: unknown) => e);
    expect(failure).toBeInstanceOf(StartupError);
    expect((failure as Error).message).toBe(`Crestline cannot start: port ${port} on 127.0.0.1 is already in use; set PORT to a free port.`);
    expect(existsSync(path.join(dir, 'server.lock'))).toBe(false);
    await start({ DATA_DIR: dir });
  });

  it('refuses a taken mail sink port with one line naming SMTP_SINK_PORT', async () => {
    const port = await takenPort();
    const failure = await startTestServer({ SMTP_SINK_PORT: String(port) }).catch((e: unknown) => e);
    expect((failure as Error).message).toBe(`Crestline cannot start: port ${port} on 127.0.0.1 is already in use; set SMTP_SINK_PORT to a free port.`);
  });

  it('refuses a second server on the same data folder, naming the first one’s pid and address', async () => {
    const dir = freshDir();
    const first = await start({ DATA_DIR: dir });
    const failure = await startTestServer({ DATA_DIR: dir }).catch((e: unknown) => e);
    expect(failure).toBeInstanceOf(StartupError);
    expect((failure as Error).message).toBe(
      `Crestline is already running from this folder (${dir}): pid ${process.pid}, ${first.url}\n` +
        `Stop that one first (Ctrl-C in its terminal, or kill ${process.pid}), or give this one its own DATA_DIR.`,
    );
    // The refused start took nothing from the first.
    expect(readFileSync(path.join(dir, 'server.lock'), 'utf8')).toContain(`url=${first.url}`);
    expect((await fetch(`${first.url}/api/health`)).status).toBe(200);
  });

  it('takes over a lock left by a process that died', async () => {
    const dir = freshDir();
    const dead = spawnSync('true').pid as number;
    writeFileSync(path.join(dir, 'server.lock'), `pid=${dead}\nstarted=1\nurl=http://127.0.0.1:1\n`);
    const app = await start({ DATA_DIR: dir });
    expect(readFileSync(path.join(dir, 'server.lock'), 'utf8')).toBe(`pid=${process.pid}\nstarted=${processStart(process.pid)}\nurl=${app.url}\n`);
  });

  it('takes over a lock whose pid now belongs to another process (started at another time)', async () => {
    const dir = freshDir();
    // This very process stands in for a newer one that was given the dead server's pid.
    writeFileSync(path.join(dir, 'server.lock'), `pid=${process.pid}\nstarted=1\nurl=http://127.0.0.1:1\n`);
    await start({ DATA_DIR: dir });
  });

  it('sweeps the upload and temporary folders, leaves the originals, and makes the folder private', async () => {
    const dir = freshDir();
    for (const sub of ['uploads', 'tmp', 'originals']) mkdirSync(path.join(dir, sub), { mode: 0o755 });
    writeFileSync(path.join(dir, 'uploads', 'a1b2c3'), 'an upload cut short');
    writeFileSync(path.join(dir, 'tmp', '7.csv-123-456'), 'an unpacked copy');
    writeFileSync(path.join(dir, 'originals', '7.csv.gz'), 'kept');
    spawnSync('chmod', ['755', dir]);
    await start({ DATA_DIR: dir });
    expect(readFileSync(path.join(dir, 'originals', '7.csv.gz'), 'utf8')).toBe('kept');
    expect(existsSync(path.join(dir, 'uploads', 'a1b2c3'))).toBe(false);
    expect(existsSync(path.join(dir, 'tmp', '7.csv-123-456'))).toBe(false);
    expect(mode(dir)).toBe('700');
    expect(mode(path.join(dir, 'session-secret'))).toBe('600');
    expect(mode(path.join(dir, 'server.lock'))).toBe('600');
  });
});
