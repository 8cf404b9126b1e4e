import { boolean, index, jsonb, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import type { FoundSet, SetFinderMode, SetFinderProgress, SetFinderRequest, SetFinderStatus } from "@shared/schemas/set-finder";
import { user } from "./users";

/**
 * A teacher's Set finder search: its request, progress and verified results, kept after it ends so the Set finder page
 * lists recent searches. The search itself runs as a pg-boss job on whichever app process picks it up.
 */
export const setFinderSearch = pgTable(
  "set_finder_search",
  {
    id: uuid("id").primaryKey(),
    ownerId: text("owner_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    status: text("status").$type<SetFinderStatus>().notNull(),
    request: jsonb("request").$type<SetFinderRequest>().notNull(),
    mode: text("mode").$type<SetFinderMode>(),
    progress: jsonb("progress").$type<SetFinderProgress>().notNull(),
    results: jsonb("results").$type<FoundSet[]>().notNull(),
    complete: boolean("complete").notNull().default(false),
    message: text("message"),
    cancelRequested: boolean("cancel_requested").notNull().default(false),
    startedAt: timestamp("started_at", { withTimezone: true }).notNull().defaultNow(),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (table) => [index("set_finder_search_owner_started_idx").on(table.ownerId, table.startedAt)],
);
