import type { Server } from 'node:http';
import { createApp } from './app';
import { loadConfig, type Config } from './config';
import type { AppContext } from './context';
import { migrateDatabase, openDatabase } from './db/client';
import { loadSessionKey } from './services/sessionSecret';
import { CaptureProcessor } from './jobs/captureProcessor';
import { IngestWorkerClient } from './workers/IngestWorkerClient';
import { createMailer } from './mail/mailer';
import { startMailSink } from './mail/mailSink';
import { ensureBootstrapAdmin } from './services/userService';

export interface RunningServer {
  ctx: AppContext;
  processor: CaptureProcessor;
  server: Server;
  url: string;
  stop(): Promise<void>;
}

/** Migrates, bootstraps the admin, and listens. Used by `npm start` and by the API tests (port 0). */
export async function startServer(overrides: Partial<Record<keyof Config, string>> = {}): Promise<RunningServer> {
  const config = loadConfig({ ...process.env, ...overrides });
  const database = openDatabase(config.DATABASE_URL);
  await migrateDatabase(database.db);
  const sink = config.SMTP_URL ? null : await startMailSink(database.db, config.SMTP_SINK_PORT);
  const ctx: AppContext = {
    config,
    db: database.db,
    mailer: createMailer(config, sink?.port ?? null),
    publicUrl: '',
    sessionKey: await loadSessionKey(config.SESSION_SECRET, config.DATA_DIR),
    spanWorkers: new IngestWorkerClient(1),
    pingDatabase: async () => {
      try {
        await database.pool.query('SELECT 1');
        return true;
      } catch {
        return false;
      }
    },
  };
  await ensureBootstrapAdmin(ctx);
  const processor = new CaptureProcessor(ctx);
  if (config.RUN_WORKER) processor.start();
  const app = createApp(ctx, { onCaptureQueued: () => processor.nudge() });
  const server = await new Promise<Server>((resolve) => {
    const s = app.listen(config.PORT, config.HOST, () => resolve(s));
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.PORT;
  ctx.publicUrl = (config.PUBLIC_URL ?? `http://${config.HOST}:${port}`).replace(/\/$/, '');
  return {
    ctx,
    processor,
    server,
    url: `http://${config.HOST}:${port}`,
    stop: async () => {
      await processor.stop();
      await ctx.spanWorkers.close();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections();
      await sink?.close();
      await database.close();
    },
  };
}
