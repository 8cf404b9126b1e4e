import path from "node:path";
import { drizzle } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import type pg from "pg";

// Any fixed 64-bit key: two processes starting at once take turns instead of racing the migrator.
const MIGRATION_LOCK_KEY = 7_413_900_211;

export const migrationsFolder = path.resolve(import.meta.dirname, "../../drizzle");

/** Applies the committed SQL migrations in drizzle/ while holding a PostgreSQL advisory lock. */
export async function runMigrations(pool: pg.Pool): Promise<void> {
  const client = await pool.connect();
  try {
    await client.query("select pg_advisory_lock($1)", [MIGRATION_LOCK_KEY]);
    await migrate(drizzle(client), { migrationsFolder });
  } finally {
    await client.query("select pg_advisory_unlock($1)", [MIGRATION_LOCK_KEY]).catch(() => undefined);
    client.release();
  }
}
