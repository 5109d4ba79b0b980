import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import { join } from 'node:path';
import pg from 'pg';
import { isDatabaseUnavailable, reportDatabaseOutage, reportDatabaseReachable } from './availability';
import { repoRoot } from './cluster';
import * as schema from './schema';

export type Database = NodePgDatabase<typeof schema>;

export const migrationsFolder = join(repoRoot, 'drizzle');

export function createPool(databaseUrl: string): pg.Pool {
  // A connection that cannot be made within 2 s fails, so that an outage is answered 503 quickly.
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 10, connectionTimeoutMillis: 2000, idleTimeoutMillis: 10_000 });
  // An idle client losing its connection (database restarted) must not crash the process; an outage is logged once.
  pool.on('error', (error) => {
    if (isDatabaseUnavailable(error)) reportDatabaseOutage(error);
    else process.stderr.write(`[db] idle connection error: ${error.message}\n`);
  });
  pool.on('connect', reportDatabaseReachable);
  return pool;
}

export function createDatabase(pool: pg.Pool): Database {
  return drizzle(pool, { schema, casing: 'snake_case' });
}

/** Applies the generated SQL migrations in drizzle/ that the database has not seen yet. */
export async function applyMigrations(db: Database): Promise<void> {
  await migrate(db, { migrationsFolder });
}
