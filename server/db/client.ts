import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import { migrate } from 'drizzle-orm/mysql2/migrator';
import mysql from 'mysql2/promise';
import type { Connection as CoreConnection } from 'mysql2';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import * as schema from './schema';

/** The drizzle handle over the pool; `$client` is the pool itself (blobTransaction takes a connection of it). */
export type Db = MySql2Database<typeof schema> & { $client: mysql.Pool };
/** The database or a transaction on it: repository functions that may run inside a transaction take this. */
export type DbOrTx = MySql2Database<typeof schema> | Parameters<Parameters<Db['transaction']>[0]>[0];

export interface Database {
  db: Db;
  pool: mysql.Pool;
  close(): Promise<void>;
}

/** A connection pool and its drizzle handle. */
export function openDatabase(url: string): Database {
  const pool = mysql.createPool({ uri: url, connectionLimit: 10, timezone: 'Z', supportBigNumbers: true, dateStrings: false });
  // mysql2 writes and reads dates as UTC (timezone 'Z'), but NOW() and the conversion of TIMESTAMP
  // columns follow the session's time zone, which defaults to the database server's. Every connection
  // is put in UTC so that `expires_at > NOW()` compares like with like. The pool emits 'connection'
  // before it hands a new connection out, and a connection runs its queries in order, so this runs
  // before anything else on it. (The event is taken on the underlying callback pool, whose listener
  // gets the connection it actually emits.)
  pool.pool.on('connection', (connection: CoreConnection) => {
    connection.query("SET time_zone = '+00:00'", (err) => {
      if (err) console.error('Could not set the database session to UTC:', err);
    });
  });
  const db = drizzle(pool, { schema, mode: 'default' });
  return { db, pool, close: () => pool.end() };
}

const migrationsFolder = path.join(path.dirname(fileURLToPath(import.meta.url)), 'migrations');

/** Applies the committed drizzle-kit migrations that have not run yet. */
export async function migrateDatabase(db: Db): Promise<void> {
  await migrate(db, { migrationsFolder });
}
