import { bigint, integer, pgTable, varchar } from "drizzle-orm/pg-core";

/** rate-limiter-flexible's RateLimiterPostgres table (its own column layout), shared by every app process. */
export const rateLimit = pgTable("rate_limit", {
  key: varchar("key", { length: 255 }).primaryKey(),
  points: integer("points").notNull().default(0),
  expire: bigint("expire", { mode: "number" }),
});
