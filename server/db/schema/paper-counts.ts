import { index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { classRun, runGroup } from "./class-runs";
import { user } from "./users";

/**
 * A group's win/tie/loss counts for one two-player matchup of one tally, typed into the tally grid for a quick paper
 * lesson. The counts stand for rolls nobody wrote down one by one: they enter every count, frequency and interval, and
 * never a per-roll figure (the convergence series, the rolls export).
 */
export const paperCount = pgTable(
  "paper_count",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    runId: uuid("run_id")
      .notNull()
      .references(() => classRun.id, { onDelete: "cascade" }),
    groupId: uuid("group_id")
      .notNull()
      .references(() => runGroup.id, { onDelete: "cascade" }),
    tally: integer("tally").notNull().default(1),
    dicePerPlayer: integer("dice_per_player").notNull(),
    // The two die indexes (into the run's dice), lower index first; the counts are from the first die's side.
    matchup: jsonb("matchup").$type<number[]>().notNull(),
    // "0-2": the matchup as text, so each group has one row per matchup and tally.
    matchupKey: text("matchup_key").notNull(),
    firstWins: integer("first_wins").notNull(),
    ties: integer("ties").notNull(),
    secondWins: integer("second_wins").notNull(),
    enteredById: text("entered_by_id")
      .notNull()
      .references(() => user.id),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    uniqueIndex("paper_count_run_group_tally_matchup_idx").on(table.runId, table.groupId, table.tally, table.matchupKey),
    index("paper_count_run_id_idx").on(table.runId),
  ],
);
