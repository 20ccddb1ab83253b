import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import { migrate } from 'drizzle-orm/mysql2/migrator';
import mysql from 'mysql2/promise';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import * as schema from './schema';

export type Db = MySql2Database<typeof schema>;

export interface Database {
  db: Db;
  pool: mysql.Pool;
  close(): Promise<void>;
}

/** A connection pool and its drizzle handle. */
export function openDatabase(url: string): Database {
  const pool = mysql.createPool({ uri: url, connectionLimit: 10, timezone: 'Z', supportBigNumbers: true, dateStrings: false });
  const db = drizzle(pool, { schema, mode: 'default' });
  return { db, pool, close: () => pool.end() };
}

const migrationsFolder = path.join(path.dirname(fileURLToPath(import.meta.url)), 'migrations');

/** Applies the committed drizzle-kit migrations that have not run yet. */
export async function migrateDatabase(db: Db): Promise<void> {
  await migrate(db, { migrationsFolder });
}
