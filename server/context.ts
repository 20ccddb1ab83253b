import type { Config } from './config';
import type { Db } from './db/client';

/** What routes and services need from the running server. */
export interface AppContext {
  config: Config;
  db: Db;
  /** HS256 key for session tokens. */
  sessionKey: Uint8Array;
  /** Answers whether the database is reachable, for /api/health. */
  pingDatabase(): Promise<boolean>;
}
