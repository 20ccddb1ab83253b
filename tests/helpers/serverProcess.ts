import { spawn, type ChildProcess } from 'node:child_process';
import { ADMIN, testDatabaseUrl } from './testServer';

export interface ServerProcess {
  child: ChildProcess;
  /** The address it serves; empty for a worker-only process. */
  url: string;
  /** Sends SIGTERM and waits for the process to end. */
  stop(): Promise<void>;
}

/**
 * `npm start`'s server process (server/index.ts, without the scripts around it) against the test
 * database, on a free port; resolves once it says it is running. `env` overrides the test defaults.
 */
export function serverProcess(dataDir: string, env: Record<string, string> = {}): Promise<ServerProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: {
      ...process.env,
      DATABASE_URL: testDatabaseUrl(),
      PORT: '0',
      HOST: '127.0.0.1',
      DATA_DIR: dataDir,
      NODE_ENV: 'test',
      SERVE_CLIENT: '0',
      RUN_WORKER: '1',
      SEED_DEMO: '0',
      BCRYPT_COST: '4',
      SMTP_SINK_PORT: '0',
      JOB_STALE_SECONDS: '1',
      ADMIN_EMAIL: ADMIN.email,
      ADMIN_PASSWORD: ADMIN.password,
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const stop = async () => {
    if (child.exitCode !== null || child.signalCode !== null) return;
    const ended = new Promise((r) => child.once('exit', r));
    child.kill('SIGTERM');
    await ended;
  };
  return new Promise((resolve, reject) => {
    let out = '';
    const timer = setTimeout(() => reject(new Error(`the server did not start in 30 s:\n${out}`)), 30_000);
    const read = (b: Buffer) => {
      out += b.toString();
      const ready = /Crestline is ready: (http:\/\/127\.0\.0\.1:\d+)/.exec(out);
      if (ready || /Crestline worker is running/.test(out)) {
        clearTimeout(timer);
        resolve({ child, url: ready?.[1] ?? '', stop });
      }
    };
    child.stdout!.on('data', read);
    child.stderr!.on('data', read);
    child.on('exit', (code) => reject(new Error(`the server exited (${code}) before it was ready:\n${out}`)));
  });
}
