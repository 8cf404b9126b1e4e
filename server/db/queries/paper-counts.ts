import { and, asc, eq, sql } from "drizzle-orm";
import type { Executor } from "../client";
import { setAsideGroups } from "./class-runs";
import { classRun, paperCount, runGroup } from "../schema/index";

export type PaperCountRow = typeof paperCount.$inferSelect;

/** A run's count rows, every tally, in a steady order; removed groups' rows never, left-out groups' only when asked. */
export async function listPaperCounts(
  executor: Executor,
  runId: string,
  options: { includeLeftOut?: boolean } = {},
): Promise<PaperCountRow[]> {
  return executor
    .select()
    .from(paperCount)
    .where(and(eq(paperCount.runId, runId), sql`${paperCount.groupId} not in (${setAsideGroups(runId, options.includeLeftOut)})`))
    .orderBy(asc(paperCount.tally), asc(paperCount.groupId), asc(paperCount.matchupKey));
}

/** One count row to store; the group is an existing group's id or a nickname the save creates. */
export type NewPaperCount = {
  groupId: string | null;
  nickname: string;
  dicePerPlayer: number;
  matchup: [number, number];
  firstWins: number;
  ties: number;
  secondWins: number;
};

/**
 * Replaces one tally's count rows of a run in one transaction: creates the new groups (as paper groups), deletes the
 * tally's rows, inserts the given ones and bumps the run's board version. Answers how many rows went and came.
 */
export async function replacePaperCounts(
  executor: Executor,
  values: { runId: string; tally: number; enteredById: string; newGroups: string[]; rows: NewPaperCount[] },
): Promise<{ removed: number; saved: number }> {
  return executor.transaction(async (tx) => {
    const groupIds = new Map<string, string>();
    if (values.newGroups.length > 0) {
      const created = await tx
        .insert(runGroup)
        .values(values.newGroups.map((nickname) => ({ runId: values.runId, nickname, source: "paper" as const })))
        .returning({ id: runGroup.id, nickname: runGroup.nickname });
      for (const group of created) groupIds.set(group.nickname.toLowerCase(), group.id);
    }
    const removed = await tx
      .delete(paperCount)
      .where(and(eq(paperCount.runId, values.runId), eq(paperCount.tally, values.tally)))
      .returning({ id: paperCount.id });
    const rows = values.rows.map((row) => ({
      runId: values.runId,
      groupId: row.groupId ?? groupIds.get(row.nickname.toLowerCase())!,
      tally: values.tally,
      dicePerPlayer: row.dicePerPlayer,
      matchup: row.matchup,
      matchupKey: row.matchup.join("-"),
      firstWins: row.firstWins,
      ties: row.ties,
      secondWins: row.secondWins,
      enteredById: values.enteredById,
    }));
    if (rows.length > 0) await tx.insert(paperCount).values(rows);
    await tx
      .update(classRun)
      .set({ boardVersion: sql`${classRun.boardVersion} + 1` })
      .where(eq(classRun.id, values.runId));
    return { removed: removed.length, saved: rows.length };
  });
}
