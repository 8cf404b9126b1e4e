import { compareDice } from "@shared/probability/index";
import { rollPhaseBudget, rollPhaseMinutes } from "@shared/lessons/roll-pace";
import { lessonPlanSchema } from "@shared/schemas/lessons";
import type { ResultsTally } from "@shared/schemas/results";
import type { StoredTallyCount, TallyCountsResult, TallyGrid, TallyGridCountsInput } from "@shared/schemas/tally-grid";
import { db } from "../db/client";
import { findLessonById } from "../db/queries/lessons";
import { listPaperCounts, replacePaperCounts, type NewPaperCount, type PaperCountRow } from "../db/queries/paper-counts";
import { listRunGroups } from "../db/queries/results";
import { HttpError } from "../http-error";
import type { TeacherContext } from "../middleware/require-teacher";
import { assertOwnsRun, runTallies, visibleRun } from "./results.service";

function storedCount(row: PaperCountRow, names: string[], nicknames: Map<string, string>): StoredTallyCount {
  return {
    group: nicknames.get(row.groupId) ?? "",
    dice: [names[row.matchup[0]], names[row.matchup[1]]],
    firstWins: row.firstWins,
    ties: row.ties,
    secondWins: row.secondWins,
    tally: row.tally,
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** Rows a group's sheet has: the lesson's rolls per group, never more than fit in its Roll phase (see roll-pace.ts). */
function plannedRollsOf(plan: unknown): number | null {
  const parsed = lessonPlanSchema.safeParse(plan);
  if (!parsed.success) return null;
  const budget = rollPhaseBudget(rollPhaseMinutes(parsed.data.phases), parsed.data.mode);
  return budget === null ? parsed.data.rollsPerGroup : Math.max(1, Math.min(parsed.data.rollsPerGroup, budget.rollsPerGroup));
}

/** The tally grid of a run the teacher may see: its dice, tallies, groups and stored counts. */
export async function getTallyGrid(teacher: TeacherContext, runId: string): Promise<TallyGrid> {
  const run = await visibleRun(teacher, runId);
  const groups = await listRunGroups(db, runId);
  const nicknames = new Map(groups.map((group) => [group.id, group.nickname]));
  const names = run.dice.map((die) => die.name);
  const lesson = run.lessonId ? await findLessonById(db, run.lessonId) : null;
  return {
    run: {
      id: run.id,
      title: run.title,
      classGroup: run.classGroup,
      dieNames: names,
      tallies: runTallies(run),
      isOwner: run.ownerId === teacher.user.id,
    },
    groups: groups.map((group) => ({ id: group.id, nickname: group.nickname, source: group.source })),
    counts: (await listPaperCounts(db, runId)).map((row) => storedCount(row, names, nicknames)),
    plannedRolls: lesson ? plannedRollsOf(lesson.plan) : null,
  };
}

function isUniqueViolation(error: unknown): boolean {
  const codeOf = (value: unknown) =>
    typeof value === "object" && value !== null && "code" in value ? (value as { code: unknown }).code : undefined;
  return codeOf(error) === "23505" || codeOf((error as { cause?: unknown } | null)?.cause) === "23505";
}

/**
 * Replaces one tally's win/tie/loss counts with the rows given (quick paper lessons: each group's counts per
 * matchup, no rolls). Two-player tallies only, since counts of three players cannot say which seats tied. Every row is
 * checked before anything is written; any problem refuses the save whole (422, each row's problems under "row N").
 */
export async function saveTallyCounts(teacher: TeacherContext, runId: string, input: TallyGridCountsInput): Promise<TallyCountsResult> {
  const run = await visibleRun(teacher, runId);
  assertOwnsRun(teacher, run, "enter results for it");
  const mode: ResultsTally | undefined = runTallies(run).find((entry) => entry.tally === input.tally);
  if (!mode)
    throw new HttpError(
      422,
      "invalid_tally",
      `This run has no tally ${input.tally}; its tallies are ${runTallies(run)
        .map((entry) => entry.tally)
        .join(" and ")}.`,
    );
  if (mode.players !== 2) {
    throw new HttpError(
      422,
      "counts_need_two_players",
      "Counts work for two-player matchups only; enter three-player rolls one by one in the rolls grid.",
    );
  }
  const groups = await listRunGroups(db, runId);
  const groupByNickname = new Map(groups.map((group) => [group.nickname.trim().toLowerCase(), group]));
  const dieIndexByName = new Map(run.dice.map((die, index) => [die.name.trim().toLowerCase(), index]));
  const setDieNames = run.dice.map((die) => die.name).join(", ");
  const newGroups = new Map<string, string>();
  const seen = new Map<string, number>();
  const errors = new Map<string, string[]>();
  const rows: NewPaperCount[] = [];
  const tieChances = new Map<string, boolean>();
  const canTie = (first: number, second: number) => {
    const key = `${first}-${second}`;
    if (!tieChances.has(key))
      tieChances.set(key, !compareDice(run.dice[first].faces, run.dice[second].faces, { dicePerPlayer: mode.dicePerPlayer }).tie.equals(0));
    return tieChances.get(key)!;
  };
  input.counts.forEach((entry, index) => {
    const rowNumber = index + 1;
    const messages: string[] = [];
    const indexes = entry.dice.map((name) => dieIndexByName.get(name.trim().toLowerCase()));
    indexes.forEach((dieIndex, seat) => {
      if (dieIndex === undefined)
        messages.push(`${seat === 0 ? "First" : "Second"} die: "${entry.dice[seat]}" is not a die of this run's set (${setDieNames}).`);
    });
    if (indexes[0] !== undefined && indexes[0] === indexes[1]) messages.push("A matchup needs two different dice.");
    const groupKey = entry.group.toLowerCase();
    const known = groupByNickname.get(groupKey);
    if (!known && !newGroups.has(groupKey)) {
      if (input.createGroups) newGroups.set(groupKey, entry.group);
      else {
        const knownNames = groups.map((group) => group.nickname).join(", ");
        messages.push(
          `This run has no group "${entry.group}"${knownNames ? ` (its groups: ${knownNames})` : " yet"}. Correct the nickname, or tick "Create groups that are new".`,
        );
      }
    }
    if (messages.length === 0) {
      const [first, second] = indexes as [number, number];
      const swapped = first > second;
      const key = `${groupKey}\u0000${Math.min(first, second)}-${Math.max(first, second)}`;
      if (entry.ties > 0 && !canTie(first, second)) {
        messages.push(
          `${run.dice[first].name} and ${run.dice[second].name} cannot tie ${mode.dicePerPlayer === 1 ? "with one die each" : `with ${mode.dicePerPlayer} dice each`}, so ties must be 0.`,
        );
      }
      const earlier = seen.get(key);
      if (earlier !== undefined)
        messages.push(`Group ${entry.group} has this matchup twice (rows ${earlier} and ${rowNumber}); add the counts into one row.`);
      else seen.set(key, rowNumber);
      // An empty row (all zero) stores nothing.
      if (messages.length === 0 && entry.firstWins + entry.ties + entry.secondWins > 0) {
        rows.push({
          groupId: known?.id ?? null,
          nickname: known?.nickname ?? newGroups.get(groupKey)!,
          dicePerPlayer: mode.dicePerPlayer,
          matchup: swapped ? [second, first] : [first, second],
          firstWins: swapped ? entry.secondWins : entry.firstWins,
          ties: entry.ties,
          secondWins: swapped ? entry.firstWins : entry.secondWins,
        });
      }
    }
    if (messages.length > 0) errors.set(`row ${rowNumber}`, messages);
  });
  if (errors.size > 0) {
    const count = errors.size;
    throw new HttpError(
      422,
      "tally_counts_invalid",
      `${count} ${count === 1 ? "row has" : "rows have"} problems, so nothing was saved. Correct ${count === 1 ? "it" : "them"} and save again.`,
      Object.fromEntries(errors),
    );
  }
  const outcome = await replacePaperCounts(db, {
    runId,
    tally: input.tally,
    enteredById: teacher.user.id,
    newGroups: [...newGroups.values()],
    rows,
  }).catch((error: unknown) => {
    if (isUniqueViolation(error)) return "conflict" as const;
    throw error;
  });
  if (outcome === "conflict")
    throw new HttpError(409, "save_conflict", "The run's groups changed while the counts were saved, so nothing was stored. Save again.");
  const grid = await getTallyGrid(teacher, runId);
  return { saved: outcome.saved, removed: outcome.removed, newGroups: [...newGroups.values()], counts: grid.counts };
}
