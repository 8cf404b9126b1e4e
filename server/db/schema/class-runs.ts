import { sql } from "drizzle-orm";
import { bigint, boolean, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import type { SetDie } from "@shared/schemas/dice-sets";
import { organization } from "./departments";
import { lesson } from "./lessons";
import { user } from "./users";

/** One tally of a class run: its number and the mode its rolls were recorded in. */
export type ClassRunTally = { tally: number; dicePerPlayer: number; players: number; startedAt: string };

/**
 * A live session of a lesson with one class. It keeps its own copy of the dice, mode and tie rule, so editing the
 * lesson or its set later never changes what a past run recorded.
 */
export const classRun = pgTable(
  "class_run",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    ownerId: text("owner_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    departmentId: text("department_id").references(() => organization.id, { onDelete: "set null" }),
    lessonId: uuid("lesson_id").references(() => lesson.id, { onDelete: "set null" }),
    title: text("title").notNull(),
    classGroup: text("class_group").notNull().default(""),
    diceSetName: text("dice_set_name").notNull(),
    dice: jsonb("dice").$type<SetDie[]>().notNull(),
    dicePerPlayer: integer("dice_per_player").notNull().default(1),
    players: integer("players").notNull().default(2),
    tieRule: text("tie_rule").notNull().default("re-roll-ties"),
    matchupChoice: text("matchup_choice", { enum: ["assigned", "group-choice"] })
      .notNull()
      .default("assigned"),
    phases: jsonb("phases").$type<string[]>().notNull(),
    phase: text("phase").notNull(),
    status: text("status", { enum: ["open", "paused", "closed"] })
      .notNull()
      .default("open"),
    joinCode: text("join_code").notNull(),
    // The Twist phase starts a fresh tally; every roll records the tally it belongs to.
    currentTally: integer("current_tally").notNull().default(1),
    // The mode of every tally so far, so a roll recorded offline under an earlier tally is still checked against its own mode.
    tallies: jsonb("tallies").$type<ClassRunTally[]>().notNull().default([]),
    // Copied from the lesson when the run opens, so later lesson edits never change what the Wall shows of this run.
    hideExactUntilProve: boolean("hide_exact_until_prove").notNull().default(true),
    discussionPrompts: jsonb("discussion_prompts").$type<string[]>().notNull().default([]),
    exitTicket: text("exit_ticket").notNull().default(""),
    // Bumped on every change the Run board shows but a new roll (the board adds the run's roll rows), so a board can tell a stale snapshot from a fresh one.
    boardVersion: bigint("board_version", { mode: "number" }).notNull().default(0),
    // The teacher's lock on joining: no new group joins while it is set.
    joiningLocked: boolean("joining_locked").notNull().default(false),
    // Most groups the run takes, chosen when it was opened.
    groupCap: integer("group_cap").notNull().default(40),
    // Set once, when the run's phone rolls reach the roll ceiling (the board's flood flag).
    rollCeilingReachedAt: timestamp("roll_ceiling_reached_at", { withTimezone: true }),
    // The last change a teacher or a group made other than a roll (rolls keep their own received_at); the idle sweep reads both.
    lastChangeAt: timestamp("last_change_at", { withTimezone: true }).notNull().defaultNow(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    closedAt: timestamp("closed_at", { withTimezone: true }),
  },
  (table) => [
    uniqueIndex("class_run_open_join_code_idx")
      .on(table.joinCode)
      .where(sql`${table.status} <> 'closed'`),
    index("class_run_owner_id_idx").on(table.ownerId),
    index("class_run_department_id_idx").on(table.departmentId),
  ],
);

/** A group of pupils in a class run, known only by the nickname it chose. */
export const runGroup = pgTable(
  "run_group",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    runId: uuid("run_id")
      .notNull()
      .references(() => classRun.id, { onDelete: "cascade" }),
    nickname: text("nickname").notNull(),
    // Die indexes (into the run's dice) of the group's matchup, one per player; null until assigned or chosen.
    matchup: jsonb("matchup").$type<number[] | null>(),
    source: text("source", { enum: ["phone", "simulated", "paper"] })
      .notNull()
      .default("phone"),
    // The nickname's confusable skeleton (shared/class-runs/nickname-rules.ts), so two look-alike nicknames cannot share a run.
    nicknameKey: text("nickname_key"),
    // The phone's id for the join attempt that made the group, so a retried join answers the same group.
    joinAttemptId: uuid("join_attempt_id"),
    // The teacher removed the group: it leaves the board and every figure, and its token is dead.
    removedAt: timestamp("removed_at", { withTimezone: true }),
    // The teacher left the group's rolls out: it stays on the board, marked, and its rolls leave every figure and export.
    leftOutAt: timestamp("left_out_at", { withTimezone: true }),
    // When the group's phone last sent rolls faster than the per-group limit (the board's flood flag).
    floodedAt: timestamp("flooded_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    uniqueIndex("run_group_run_nickname_idx").on(table.runId, sql`lower(${table.nickname})`),
    uniqueIndex("run_group_run_nickname_key_idx").on(table.runId, table.nicknameKey),
    uniqueIndex("run_group_run_join_attempt_idx").on(table.runId, table.joinAttemptId),
  ],
);

/** A group's Guess-phase vote for the die it thinks is best; a group may change its mind, keeping one vote. */
export const guessVote = pgTable(
  "guess_vote",
  {
    runId: uuid("run_id")
      .notNull()
      .references(() => classRun.id, { onDelete: "cascade" }),
    groupId: uuid("group_id")
      .notNull()
      .references(() => runGroup.id, { onDelete: "cascade" }),
    dieIndex: integer("die_index").notNull(),
    votedAt: timestamp("voted_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [uniqueIndex("guess_vote_run_group_idx").on(table.runId, table.groupId)],
);

/** A Paper import upload; its file hash stops the same sheet being imported twice. */
export const paperImport = pgTable(
  "paper_import",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    runId: uuid("run_id")
      .notNull()
      .references(() => classRun.id, { onDelete: "cascade" }),
    fileHash: text("file_hash").notNull(),
    fileName: text("file_name").notNull(),
    rowCount: integer("row_count").notNull(),
    importedById: text("imported_by_id")
      .notNull()
      .references(() => user.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [uniqueIndex("paper_import_run_file_hash_idx").on(table.runId, table.fileHash)],
);

/**
 * One recorded roll. The id is generated on the pupil's phone, so a resent roll hits the primary key and is stored once.
 * An undone roll keeps its row (with undoneAt) so a late resend of the same id cannot bring it back.
 */
export const roll = pgTable(
  "roll",
  {
    id: uuid("id").primaryKey(),
    runId: uuid("run_id")
      .notNull()
      .references(() => classRun.id, { onDelete: "cascade" }),
    groupId: uuid("group_id")
      .notNull()
      .references(() => runGroup.id, { onDelete: "cascade" }),
    tally: integer("tally").notNull().default(1),
    dicePerPlayer: integer("dice_per_player").notNull(),
    matchup: jsonb("matchup").$type<number[]>().notNull(),
    // Faces rolled, one list per player (a list of dicePerPlayer faces each).
    faces: jsonb("faces").$type<number[][]>().notNull(),
    totals: jsonb("totals").$type<number[]>().notNull(),
    // Seat (0, 1, 2) of the player with the highest total; null when the highest total is shared (a tie).
    winnerSeat: integer("winner_seat"),
    source: text("source", { enum: ["phone", "simulated", "paper"] })
      .notNull()
      .default("phone"),
    paperImportId: uuid("paper_import_id").references(() => paperImport.id, { onDelete: "cascade" }),
    recordedAt: timestamp("recorded_at", { withTimezone: true }).notNull(),
    receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
    undoneAt: timestamp("undone_at", { withTimezone: true }),
  },
  (table) => [index("roll_run_tally_idx").on(table.runId, table.tally), index("roll_group_id_idx").on(table.groupId)],
);
