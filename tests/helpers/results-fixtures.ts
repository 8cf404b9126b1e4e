// Closed class runs with rolls, written straight into a database, for the Results tests (integration and browser).
import { and, asc, eq } from "drizzle-orm";
import type { NodePgDatabase } from "drizzle-orm/node-postgres";
import { mulberry32, randomBelow } from "@shared/probability/index";
import type { SetDie } from "@shared/schemas/dice-sets";
import { classRun, guessVote, roll, runGroup, user } from "../../server/db/schema/index";
import type * as schema from "../../server/db/schema/index";

type AnyDatabase = NodePgDatabase<typeof schema>;

/**
 * The id of the seeded closed run of a demo lesson (the oldest closed run of that title by its owner), or null. Other
 * browser tests may make newer runs of the same lesson, such as a paper run.
 */
export async function findSeededDemoRun(db: AnyDatabase, lesson: { title: string; ownerEmail: string }): Promise<string | null> {
  const [run] = await db
    .select({ id: classRun.id })
    .from(classRun)
    .innerJoin(user, eq(user.id, classRun.ownerId))
    .where(and(eq(user.email, lesson.ownerEmail), eq(classRun.title, lesson.title), eq(classRun.status, "closed")))
    .orderBy(asc(classRun.createdAt))
    .limit(1);
  return run?.id ?? null;
}

/**
 * Our own three-dice cycle (sea birds; faces found by a seeded search over splits of 1–18 into three dice):
 * Skua beats Tern 5/9, Tern beats Gannet 5/9, Gannet beats Skua 7/12, with no ties.
 */
export const testDice: SetDie[] = [
  { name: "Skua", faces: [1, 5, 10, 12, 13, 15], colour: "teal", pattern: "dots" },
  { name: "Tern", faces: [4, 7, 8, 9, 11, 18], colour: "amber", pattern: "stripes" },
  { name: "Gannet", faces: [2, 3, 6, 14, 16, 17], colour: "plum", pattern: "checks" },
];

export type FixtureGroup = {
  nickname: string;
  matchup: number[];
  rolls: number;
  source?: "phone" | "simulated" | "paper";
  undone?: number;
};

export type FixtureRun = {
  ownerEmail: string;
  title: string;
  classGroup: string;
  dice?: SetDie[];
  diceSetName?: string;
  status?: "open" | "paused" | "closed";
  tieRule?: string;
  players?: number;
  dicePerPlayer?: number;
  createdAt?: Date;
  groups: FixtureGroup[];
  votes?: number[];
  seed?: number;
};

export async function userIdByEmail(db: AnyDatabase, email: string): Promise<{ id: string; departmentId: string | null }> {
  const found = await db.query.user.findFirst({ where: eq(user.email, email) });
  if (!found) throw new Error(`no user ${email}`);
  const membership = await db.query.member.findFirst({ where: (member, { eq: equals }) => equals(member.userId, found.id) });
  return { id: found.id, departmentId: membership?.organizationId ?? null };
}

/** Inserts a run with its groups, seeded-random fair rolls (some undone when asked) and Guess votes; answers its id. */
export async function insertFixtureRun(db: AnyDatabase, fixture: FixtureRun): Promise<{ runId: string; groupIds: string[] }> {
  const owner = await userIdByEmail(db, fixture.ownerEmail);
  const dice = fixture.dice ?? testDice;
  const dicePerPlayer = fixture.dicePerPlayer ?? 1;
  const createdAt = fixture.createdAt ?? new Date();
  const [run] = await db
    .insert(classRun)
    .values({
      ownerId: owner.id,
      departmentId: owner.departmentId,
      title: fixture.title,
      classGroup: fixture.classGroup,
      diceSetName: fixture.diceSetName ?? "Skerry trio",
      dice,
      dicePerPlayer,
      players: fixture.players ?? 2,
      tieRule: fixture.tieRule ?? "re-roll-ties",
      phases: ["Guess", "Roll", "Pool", "Prove"],
      phase: "Prove",
      status: fixture.status ?? "closed",
      joinCode: `T${Math.random().toString(36).slice(2, 8).toUpperCase()}`,
      createdAt,
      closedAt: (fixture.status ?? "closed") === "closed" ? new Date(createdAt.getTime() + 3_600_000) : null,
    })
    .returning({ id: classRun.id });
  const random = mulberry32(fixture.seed ?? 7);
  const groupIds: string[] = [];
  let clock = createdAt.getTime();
  for (const group of fixture.groups) {
    const [created] = await db
      .insert(runGroup)
      .values({ runId: run.id, nickname: group.nickname, matchup: group.matchup, source: group.source ?? "phone" })
      .returning({ id: runGroup.id });
    groupIds.push(created.id);
    const rows: (typeof roll.$inferInsert)[] = [];
    for (let index = 0; index < group.rolls; index += 1) {
      const faces = group.matchup.map((dieIndex) =>
        Array.from({ length: dicePerPlayer }, () => dice[dieIndex].faces[randomBelow(random, dice[dieIndex].faces.length)]),
      );
      const totals = faces.map((list) => list.reduce((sum, face) => sum + face, 0));
      const highest = Math.max(...totals);
      const top = totals.flatMap((total, seat) => (total === highest ? [seat] : []));
      clock += 1000;
      rows.push({
        id: crypto.randomUUID(),
        runId: run.id,
        groupId: created.id,
        dicePerPlayer,
        matchup: group.matchup,
        faces,
        totals,
        winnerSeat: top.length === 1 ? top[0] : null,
        source: group.source ?? "phone",
        recordedAt: new Date(clock),
        undoneAt: index < (group.undone ?? 0) ? new Date(clock + 500) : null,
      });
    }
    for (let start = 0; start < rows.length; start += 1000) await db.insert(roll).values(rows.slice(start, start + 1000));
  }
  for (const [index, dieIndex] of (fixture.votes ?? []).entries()) {
    if (groupIds[index]) await db.insert(guessVote).values({ runId: run.id, groupId: groupIds[index], dieIndex });
  }
  return { runId: run.id, groupIds };
}
