import type { Config } from './config';
import type { Db } from './db/client';
import type { Mailer } from './mail/mailer';
import type { IngestWorkerPool } from './workers/IngestWorkerPool';

/** What routes and services need from the running server. */
export interface AppContext {
  config: Config;
  db: Db;
  /** HS256 key for session tokens. */
  sessionKey: Uint8Array;
  mailer: Mailer;
  /** Base of links in mail, without a trailing slash. */
  publicUrl: string;
  /** Answers whether the database is reachable, for /api/health. */
  pingDatabase(): Promise<boolean>;
  /** A worker thread for figures computed on request (span figures), so requests never block the event loop. */
  spanWorkers: IngestWorkerPool;
}
