/**
 * `npm start`'s script as a person runs it: real bash, real MariaDB, real server processes, each with a
 * data folder of its own. Database ports are derived from TEST_DB_PORT so that runs in other checkouts
 * (each with its own TEST_DB_PORT) do not collide; every other port is one the system hands out.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer, type Server } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const base = Number(process.env.TEST_DB_PORT ?? 3407);
const DB_A = String(base + 100);
const DB_B = String(base + 101);
const dirA = mkdtempSync(path.join(tmpdir(), 'crestline-ops-a-'));
const dirB = mkdtempSync(path.join(tmpdir(), 'crestline-ops-b-'));

interface Run {
  child: ChildProcess;
  stdout: () => string;
  stderr: () => string;
  exited: Promise<number | null>;
}
const runs: Run[] = [];
const blockers: Server[] = [];

function startScript(env: Record<string, string>): Run {
  // The script makes its own database; nothing of the test database may leak into it.
  const inherited = { ...process.env };
  delete inherited.DATABASE_URL;
  delete inherited.TEST_DATABASE_URL;
  const child = spawn('bash', ['scripts/start.sh'], {
    env: { ...inherited, HOST: '127.0.0.1', SEED_DEMO: '0', SKIP_BUILD: '1', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  let err = '';
  child.stdout?.on('data', (d: Buffer) => (out += d.toString()));
  child.stderr?.on('data', (d: Buffer) => (err += d.toString()));
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  const run = { child, stdout: () => out, stderr: () => err, exited };
  runs.push(run);
  return run;
}

/** Polls until `probe` gives a value, failing after `ms` with what was printed so far. */
async function waitFor<T>(what: string, probe: () => T | null | undefined | false, ms: number, run?: Run): Promise<T> {
  const until = Date.now() + ms;
  for (;;) {
    const value = probe();
    if (value) return value;
    if (Date.now() > until) throw new Error(`${what} not within ${ms} ms\n${run ? `${run.stdout()}\n${run.stderr()}` : ''}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

async function exitCode(run: Run, ms: number): Promise<number | null> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => (timer = setTimeout(() => reject(new Error(`still running after ${ms} ms\n${run.stdout()}\n${run.stderr()}`)), ms)));
  try {
    return await Promise.race([run.exited, timeout]);
  } finally {
    clearTimeout(timer);
  }
}

const readyUrl = (run: Run) => /Crestline is ready: (http:\S+)/.exec(run.stdout())?.[1];
/** Running, not merely a zombie waiting for its parent (an orphaned MariaDB's parent is whatever adopted it). */
const alive = (pid: number) => {
  try {
    return !/^\d+ \(.*\) Z /.test(readFileSync(`/proc/${pid}/stat`, 'utf8'));
  } catch {
    return false;
  }
};
const lockPid = (dir: string) => Number(/^pid=(\d+)$/m.exec(readFileSync(path.join(dir, 'server.lock'), 'utf8'))?.[1]);
const dbPid = (dir: string) => Number(readFileSync(path.join(dir, 'dev', 'mariadb.pid'), 'utf8'));

async function takenPort(): Promise<string> {
  const blocker = createServer();
  blockers.push(blocker);
  await new Promise<void>((resolve) => blocker.listen(0, '127.0.0.1', resolve));
  return String((blocker.address() as { port: number }).port);
}

let a: Run;
let urlA: string;

beforeAll(async () => {
  // Locks of a start that was killed: a flock file (unlocked, as the kernel leaves it) and a server
  // lock naming a process that has exited.
  const dead = spawnSync('true').pid as number;
  writeFileSync(path.join(dirA, 'start.lock'), `pid=${dead}\nurl=http://127.0.0.1:1\n`);
  writeFileSync(path.join(dirA, 'server.lock'), `pid=${dead}\nstarted=1\nurl=http://127.0.0.1:1\n`);
  a = startScript({ DATA_DIR: dirA, PORT: '0', DB_PORT: DB_A });
  urlA = await waitFor('the first start to be ready', () => readyUrl(a), 90_000, a);
}, 100_000);

afterAll(async () => {
  for (const run of runs) {
    if (run.child.exitCode !== null || run.child.signalCode !== null) continue;
    run.child.kill('SIGTERM');
    await exitCode(run, 20_000).catch(() => run.child.kill('SIGKILL'));
  }
  for (const dir of [dirA, dirB]) {
    if (existsSync(path.join(dir, 'server.lock'))) {
      const pid = lockPid(dir);
      if (pid && alive(pid)) process.kill(pid, 'SIGKILL');
    }
    spawnSync('bash', ['scripts/db.sh', 'down', 'dev'], { env: { ...process.env, DATA_DIR: dir }, timeout: 30_000 });
    rmSync(dir, { recursive: true, force: true });
  }
  for (const b of blockers) b.close();
}, 90_000);

describe('npm start (scripts/start.sh)', () => {
  it('starts although a killed start left its lock files behind', () => {
    expect(lockPid(dirA)).not.toBe(0);
    expect(readFileSync(path.join(dirA, 'server.lock'), 'utf8')).toContain(`url=${urlA}`);
  });

  it('refuses a second start from the same folder with two lines naming the first, and leaves the first alone', async () => {
    const db = dbPid(dirA);
    const second = startScript({ DATA_DIR: dirA, PORT: '0', DB_PORT: DB_B });
    expect(await exitCode(second, 15_000)).toBe(1);
    const pid = lockPid(dirA);
    expect(second.stderr()).toBe(
      `Crestline is already running from this folder (${dirA}): pid ${pid}, ${urlA}\n` +
        `Stop that one first (Ctrl-C in its terminal, or kill ${pid}), or give this one its own DATA_DIR.\n`,
    );
    expect(second.stdout()).toBe('');
    expect(alive(db)).toBe(true);
    const health = await fetch(`${urlA}/api/health`);
    expect(health.status).toBe(200);
    expect(await health.json()).toEqual({ status: 'ok', db: 'ok' });
  });

  it('refuses a taken HTTP port with one line naming PORT, before starting MariaDB', async () => {
    const port = await takenPort();
    const run = startScript({ DATA_DIR: dirB, PORT: port, DB_PORT: DB_B });
    expect(await exitCode(run, 15_000)).toBe(1);
    expect(run.stderr()).toBe(`Crestline cannot start: port ${port} on 127.0.0.1 is already in use; set PORT to a free port.\n`);
    expect(existsSync(path.join(dirB, 'dev'))).toBe(false);
  });

  it('refuses a taken database port with one line naming DB_PORT', async () => {
    const port = await takenPort();
    const run = startScript({ DATA_DIR: dirB, PORT: '0', DB_PORT: port });
    expect(await exitCode(run, 30_000)).toBe(1);
    expect(run.stderr()).toBe(`Crestline cannot start: port ${port} on 127.0.0.1 is already in use; set DB_PORT to a free port.\n`);
  }, 40_000);

  it('exits with the server’s status when the server fails after MariaDB started, and stops that MariaDB', async () => {
    const port = await takenPort();
    const run = startScript({ DATA_DIR: dirB, PORT: '0', DB_PORT: DB_B, SMTP_SINK_PORT: port });
    await waitFor('MariaDB to start', () => existsSync(path.join(dirB, 'dev', 'mariadb.pid')), 30_000, run);
    const db = dbPid(dirB);
    expect(await exitCode(run, 45_000)).toBe(1);
    expect(run.stderr()).toBe(`Crestline cannot start: port ${port} on 127.0.0.1 is already in use; set SMTP_SINK_PORT to a free port.\n`);
    expect(run.stdout()).toContain('Stopping MariaDB...');
    expect(alive(db)).toBe(false);
  }, 60_000);

  it('starts again after the whole start was killed with SIGKILL, taking over the MariaDB it left running', async () => {
    const db = dbPid(dirA);
    const server = lockPid(dirA);
    a.child.kill('SIGKILL');
    process.kill(server, 'SIGKILL');
    await exitCode(a, 5_000);
    await waitFor('the killed server to be gone', () => !alive(server), 5_000);
    expect(alive(db)).toBe(true);

    a = startScript({ DATA_DIR: dirA, PORT: '0', DB_PORT: DB_A });
    urlA = await waitFor('the new start to be ready', () => readyUrl(a), 60_000, a);
    expect(dbPid(dirA)).toBe(db);
    expect((await fetch(`${urlA}/api/health`)).status).toBe(200);
  }, 75_000);

  it('stops the server first and MariaDB after it on SIGINT, and exits with the server’s status', async () => {
    const server = lockPid(dirA);
    const db = dbPid(dirA);
    a.child.kill('SIGINT');
    expect(await exitCode(a, 45_000)).toBe(0);
    const out = a.stdout();
    expect(out.indexOf('SIGINT: stopping Crestline...')).toBeGreaterThan(-1);
    expect(out.indexOf('Crestline stopped.')).toBeGreaterThan(out.indexOf('SIGINT: stopping Crestline...'));
    expect(out.indexOf('Stopping MariaDB...')).toBeGreaterThan(out.indexOf('Crestline stopped.'));
    expect(alive(server)).toBe(false);
    expect(alive(db)).toBe(false);
    expect(existsSync(path.join(dirA, 'server.lock'))).toBe(false);
  }, 60_000);
});
