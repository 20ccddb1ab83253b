import { createServer, type Server } from 'node:http';
import { createApp } from './app';
import { loadConfig, type Config } from './config';
import type { AppContext } from './context';
import { migrateDatabase, openDatabase } from './db/client';
import { loadSessionKey } from './services/sessionSecret';
import { CaptureProcessor } from './jobs/captureProcessor';
import { IngestWorkerPool } from './workers/IngestWorkerPool';
import { createMailer } from './mail/mailer';
import { startMailSink } from './mail/mailSink';
import { lockDataDir } from './services/dataDirLock';
import { makePrivateDataDir, sweepScratch } from './services/dataDir';
import { ensureBootstrapAdmin } from './services/userService';
import { listenError, StartupError } from './startupError';

export interface RunningServer {
  ctx: AppContext;
  processor: CaptureProcessor;
  server: Server;
  url: string;
  /** Port of the local SMTP sink, or null when mail goes to SMTP_URL. */
  mailSinkPort: number | null;
  /** Processor, HTTP server, mail sink, database pool, then the data folder's lock. */
  stop(): Promise<void>;
}

/** Requests still running this long after a stop are cut, so a slow client cannot hold the stop up. */
const HTTP_GRACE_MS = 5000;

function listen(server: Server, port: number, host: string): Promise<void> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      resolve();
    });
  });
}

async function closeHttp(server: Server): Promise<void> {
  const closed = new Promise<void>((resolve) => server.close(() => resolve()));
  server.closeIdleConnections();
  let timer: NodeJS.Timeout | undefined;
  await Promise.race([closed, new Promise<void>((resolve) => (timer = setTimeout(resolve, HTTP_GRACE_MS)))]);
  clearTimeout(timer);
  server.closeAllConnections();
  await closed;
}

/** Runs the closing steps newest first; one that fails is reported and the others still run. */
async function runTeardown(steps: Array<() => Promise<void>>): Promise<void> {
  for (const step of steps.reverse()) {
    try {
      await step();
    } catch (err) {
      console.error('stopping:', err);
    }
  }
}

/**
 * Takes the data folder, migrates, bootstraps the admin, and listens; prints nothing. Used by `npm
 * start` and by the API tests (port 0). A start that fails half-way closes what it had opened, and a
 * failure the person starting it can fix (port in use, folder taken, bad setting) is a StartupError.
 */
export async function startServer(overrides: Partial<Record<keyof Config, string>> = {}): Promise<RunningServer> {
  let config: Config;
  try {
    config = loadConfig({ ...process.env, ...overrides });
  } catch (err) {
    throw new StartupError((err as Error).message);
  }
  await makePrivateDataDir(config.DATA_DIR);
  const lock = await lockDataDir(config.DATA_DIR);
  const teardown: Array<() => Promise<void>> = [() => lock.release()];
  try {
    const swept = await sweepScratch(config.DATA_DIR);
    if (swept) console.log(`Removed ${swept} leftover file(s) of earlier runs from ${config.DATA_DIR}/uploads and tmp.`);
    const database = openDatabase(config.DATABASE_URL);
    teardown.push(() => database.close());
    await migrateDatabase(database.db);
    let sink = null;
    if (!config.SMTP_URL && config.RUN_HTTP) {
      sink = await startMailSink(database.db, config.SMTP_SINK_PORT).catch((err: unknown) => {
        throw listenError(err, config.SMTP_SINK_PORT, '127.0.0.1', 'SMTP_SINK_PORT');
      });
      teardown.push(sink.close);
    }
    const ctx: AppContext = {
      config,
      db: database.db,
      mailer: createMailer(config, sink?.port ?? null),
      publicUrl: '',
      sessionKey: await loadSessionKey(config.SESSION_SECRET, config.DATA_DIR),
      spanWorkers: new IngestWorkerPool(1),
      pingDatabase: async () => {
        try {
          await database.pool.query('SELECT 1');
          return true;
        } catch {
          return false;
        }
      },
    };
    teardown.push(() => ctx.spanWorkers.close());
    await ensureBootstrapAdmin(ctx);
    const processor = new CaptureProcessor(ctx);
    const server = createServer(createApp(ctx, { onCaptureQueued: () => processor.nudge(), readUpload: (bytes) => processor.readUpload(bytes) }));
    if (config.RUN_HTTP) {
      await listen(server, config.PORT, config.HOST).catch((err: unknown) => {
        throw listenError(err, config.PORT, config.HOST, 'PORT');
      });
      teardown.push(() => closeHttp(server));
    }
    // The processor starts once the server listens, so a start that fails before has no job half-done.
    if (config.RUN_WORKER) processor.start();
    teardown.push(() => processor.stop());
    const address = server.address();
    const port = typeof address === 'object' && address ? address.port : config.PORT;
    // A worker-only process has no address: it only takes jobs from the shared queue.
    const url = config.RUN_HTTP ? `http://${config.HOST}:${port}` : '';
    ctx.publicUrl = (config.PUBLIC_URL ?? url).replace(/\/$/, '');
    await lock.setUrl(url || 'a worker-only process (no HTTP)');
    let stopping: Promise<void> | null = null;
    return {
      ctx,
      processor,
      server,
      url,
      mailSinkPort: sink?.port ?? null,
      stop: () => (stopping ??= runTeardown(teardown)),
    };
  } catch (err) {
    await runTeardown(teardown);
    throw err;
  }
}
