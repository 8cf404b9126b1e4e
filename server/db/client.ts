import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import { env } from "../env";
import { logger } from "../logger";
import * as schema from "./schema/index";

/**
 * Keeps a process alive when PostgreSQL restarts or drops a connection: an error on an idle client (the pool's "error")
 * or on a checked-out one (each client's own "error") is logged, the broken client is discarded, and the next query
 * opens a fresh connection. Without these handlers node exits on "Unhandled 'error' event".
 */
export function guardPool(pool: pg.Pool, name: string): pg.Pool {
  pool.on("error", (error) =>
    logger.warn({ err: error, pool: name }, "an idle database connection failed; it is replaced on the next query"),
  );
  pool.on("connect", (client) => {
    client.on("error", (error) => logger.warn({ err: error, pool: name }, "a database connection in use failed"));
  });
  return pool;
}

export const pool = guardPool(
  new pg.Pool({ connectionString: env.DATABASE_URL, max: env.DATABASE_POOL_SIZE, connectionTimeoutMillis: 5_000 }),
  "app",
);

export const db = drizzle(pool, { schema, casing: "snake_case" });

export type Database = typeof db;
/** A transaction handle, accepted wherever `db` is, so queries compose into one transaction. */
export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];
export type Executor = Database | Transaction;
