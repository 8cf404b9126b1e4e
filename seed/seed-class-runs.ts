import { and, eq } from "drizzle-orm";
import { assignedMatchup } from "@shared/class-results/assigned-matchups";
import { simulatedMatchupRolls, winnerSeatOf } from "@shared/class-results/virtual-class";
import { mulberry32, randomBelow } from "@shared/probability/index";
import { lessonPlanSchema } from "@shared/schemas/lessons";
import type { Database } from "../server/db/client";
import {
  findLessonForRun,
  findRunOfLesson,
  insertGroups,
  insertRolls,
  listVotes,
  upsertVote,
  type NewRoll,
} from "../server/db/queries/class-runs";
import { lesson, user } from "../server/db/schema/index";
import { insertRunWithJoinCode, runValuesFromLesson } from "../server/services/class-runs.service";
import { demoRunLesson } from "./demo-scenario";

/** Invented group nicknames for the demo run (no pupil's name, as on a real run). */
export const demoRunGroups = ["Rockpool Rangers", "Gull Patrol", "Kelp Crew", "Harbour Seals", "Lighthouse Lot", "Tide Turners"] as const;
const ROLLS_PER_GROUP = 50;
const DEMO_SEED = 20_260_310;
// The demo lesson was taught on a fixed, invented morning, so the seed gives the same run every time.
const TAUGHT_AT = Date.UTC(2026, 2, 10, 9, 5, 0);

/**
 * One closed class run of the demo lesson, with six groups' votes and 300 rolls from the engine's seeded simulation,
 * so a new user sees a full Run board at once. Skips quietly when the lesson (or its dice set) is not seeded yet.
 */
export async function seedClassRuns(db: Database): Promise<{ runId: string | null }> {
  const [owned] = await db
    .select({ id: lesson.id, ownerId: lesson.ownerId, departmentId: lesson.departmentId })
    .from(lesson)
    .innerJoin(user, eq(lesson.ownerId, user.id))
    .where(and(eq(user.email, demoRunLesson.ownerEmail), eq(lesson.title, demoRunLesson.title)))
    .limit(1);
  if (!owned) {
    console.log(`Demo class run skipped: the lesson "${demoRunLesson.title}" is not in the database yet.`);
    return { runId: null };
  }
  const existing = await findRunOfLesson(db, owned.id, demoRunLesson.title);
  if (existing) return { runId: existing.id };
  const source = await findLessonForRun(db, owned.id);
  const plan = lessonPlanSchema.safeParse(source?.plan);
  if (!source?.diceSet || !plan.success || plan.data.mode.players > source.diceSet.dice.length) {
    console.log("Demo class run skipped: the demo lesson has no dice set or its plan does not check.");
    return { runId: null };
  }

  const values = runValuesFromLesson(source, plan.data, owned.ownerId, owned.departmentId);
  const closedAt = new Date(TAUGHT_AT + 55 * 60_000);
  const run = await insertRunWithJoinCode(db, {
    ...values,
    status: "closed",
    phase: values.phases[values.phases.length - 1],
    tallies: values.tallies.map((tally) => ({ ...tally, startedAt: new Date(TAUGHT_AT).toISOString() })),
    createdAt: new Date(TAUGHT_AT),
    closedAt,
  });
  await db.transaction(async (tx) => {
    const groups = await insertGroups(
      tx,
      demoRunGroups.map((nickname, index) => ({
        runId: run.id,
        nickname,
        source: "phone" as const,
        matchup: assignedMatchup(run.dice.length, run.players, index),
        createdAt: new Date(TAUGHT_AT + index * 20_000),
      })),
    );
    const votes = mulberry32(DEMO_SEED);
    for (const group of groups) await upsertVote(tx, run.id, group.id, randomBelow(votes, run.dice.length));
    const rollPhaseStart = TAUGHT_AT + 6 * 60_000;
    const rolls: NewRoll[] = groups.flatMap((group, groupIndex) =>
      simulatedMatchupRolls({
        dice: group.matchup!.map((index) => run.dice[index].faces),
        dicePerPlayer: run.dicePerPlayer,
        rolls: ROLLS_PER_GROUP,
        seed: DEMO_SEED + groupIndex,
      }).map((entry, rollIndex) => ({
        id: crypto.randomUUID(),
        runId: run.id,
        groupId: group.id,
        tally: 1,
        dicePerPlayer: run.dicePerPlayer,
        matchup: group.matchup!,
        faces: entry.faces,
        totals: entry.totals,
        winnerSeat: winnerSeatOf(entry.totals),
        // The demo stands for rolls typed on phones; they come from the seeded simulation, about one every 20 s per group.
        source: "phone" as const,
        recordedAt: new Date(rollPhaseStart + rollIndex * 20_000 + groupIndex * 3_000),
      })),
    );
    await insertRolls(tx, rolls);
  });
  const voteCount = (await listVotes(db, run.id)).length;
  console.log(
    `Demo class run "${run.title}" added: ${demoRunGroups.length} groups, ${voteCount} votes, ${demoRunGroups.length * ROLLS_PER_GROUP} rolls.`,
  );
  return { runId: run.id };
}
