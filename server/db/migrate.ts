import { readFileSync } from "node:fs";
import path from "node:path";
import { drizzle } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import type pg from "pg";
import { env } from "../env";

// Any fixed 64-bit key: two processes starting at once take turns instead of racing the migrator.
const MIGRATION_LOCK_KEY = 7_413_900_211;

export const migrationsFolder = path.join(env.projectRoot, "drizzle");

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

/** How many migrations drizzle/ holds (its journal's entries). */
export function committedMigrationCount(): number {
  const journal = JSON.parse(readFileSync(path.join(migrationsFolder, "meta/_journal.json"), "utf8")) as { entries: unknown[] };
  return journal.entries.length;
}

/** Whether the database has every committed migration applied; rejects when the database cannot be reached. */
export async function migrationsApplied(pool: pg.Pool): Promise<boolean> {
  const result = await pool
    .query<{ count: string }>("select count(*)::text as count from drizzle.__drizzle_migrations")
    .catch((error: { code?: string }) => {
      // 42P01: the table is not there yet (a fresh database before its first migration).
      if (error.code === "42P01" || error.code === "3F000") return { rows: [{ count: "0" }] };
      throw error;
    });
  return Number(result.rows[0].count) >= committedMigrationCount();
}
