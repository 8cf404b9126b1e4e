import { eq } from "drizzle-orm";
import { io as connect, type Socket } from "socket.io-client";
import { v4 as uuidv4 } from "uuid";
import { emptyLessonInput, LESSON_PHASES, type LessonInput, type LessonPhaseName } from "@shared/schemas/lessons";
import type { SetDie } from "@shared/schemas/dice-sets";
import { EVENTS, type GroupJoinAck, type PadState, type RollPayload, type RollRecordAck } from "@shared/events";
import { db, type Database } from "../../server/db/client";
import { diceSet, lesson, user } from "../../server/db/schema/index";

/** Invented dice for the class-run tests. */
export const testDice: SetDie[] = [
  { name: "Auk", faces: [1, 1, 5, 5, 6, 6], colour: "teal", pattern: "dots" },
  { name: "Razorbill", faces: [2, 3, 3, 4, 7, 7], colour: "amber", pattern: "stripes" },
  { name: "Guillemot", faces: [0, 4, 4, 4, 4, 8], colour: "plum", pattern: "checks" },
];

export type LessonOptions = Partial<Pick<LessonInput, "mode" | "tieRule" | "matchupChoice">> & {
  phases?: LessonPhaseName[];
  dice?: SetDie[];
  withoutSet?: boolean;
};

/** A lesson of `ownerId` with its own dice set, written straight into the database (the Lessons screens are not under test here). */
export async function createLessonFor(ownerEmail: string, options: LessonOptions = {}, database: Database = db): Promise<string> {
  const db = database;
  const owner = await db.query.user.findFirst({ where: eq(user.email, ownerEmail) });
  if (!owner) throw new Error(`no user ${ownerEmail}`);
  const membership = await db.query.member.findFirst({ where: (member, { eq: equals }) => equals(member.userId, owner.id) });
  const departmentId = membership?.organizationId ?? null;
  const [set] = options.withoutSet
    ? [null]
    : await db
        .insert(diceSet)
        .values({ ownerId: owner.id, departmentId, name: "Cliff-top three", dice: options.dice ?? testDice })
        .returning();
  const base = emptyLessonInput();
  const included = options.phases ?? [...LESSON_PHASES];
  const {
    title: _t,
    classGroup: _c,
    diceSetId: _d,
    status: _s,
    ...plan
  } = {
    ...base,
    mode: options.mode ?? base.mode,
    tieRule: options.tieRule ?? base.tieRule,
    matchupChoice: options.matchupChoice ?? base.matchupChoice,
    phases: base.phases.map((entry) => ({ ...entry, included: included.includes(entry.phase) })),
  };
  const [row] = await db
    .insert(lesson)
    .values({
      ownerId: owner.id,
      departmentId,
      title: `Cliff-top run ${uuidv4().slice(0, 6)}`,
      classGroup: "8K",
      status: "ready",
      diceSetId: set?.id ?? null,
      plan,
    })
    .returning();
  return row.id;
}

/** Signs in over HTTP and answers the session cookie header, for a Run board's socket. */
export async function sessionCookie(baseUrl: string, email: string, password: string): Promise<string> {
  const response = await fetch(`${baseUrl}/api/auth/sign-in/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: baseUrl },
    body: JSON.stringify({ email, password }),
  });
  if (response.status !== 200) throw new Error(`sign-in failed for ${email}: ${response.status}`);
  return response.headers
    .getSetCookie()
    .map((cookie) => cookie.split(";")[0])
    .join("; ");
}

/** A socket.io client as a phone or a board would open it (websocket only, so each test's client is quick to start). */
export function openSocket(baseUrl: string, cookie?: string): Promise<Socket> {
  const socket = connect(baseUrl, {
    path: "/socket.io",
    transports: ["websocket"],
    forceNew: true,
    reconnection: true,
    reconnectionDelay: 100,
    reconnectionDelayMax: 500,
    extraHeaders: cookie ? { cookie } : undefined,
  });
  return new Promise((resolve, reject) => {
    socket.once("connect", () => resolve(socket));
    socket.once("connect_error", reject);
  });
}

/** One pupil group: its socket, token and state after joining. */
export type TestPupil = { socket: Socket; token: string; state: PadState };

export async function joinAsPupil(baseUrl: string, code: string, nickname: string): Promise<TestPupil> {
  const socket = await openSocket(baseUrl);
  const ack: GroupJoinAck = await socket.emitWithAck(EVENTS.groupJoin, { code, nickname });
  if (!ack.ok) throw new Error(`join failed: ${ack.error.code} ${ack.error.message}`);
  return { socket, token: ack.token, state: ack.state };
}

/** A roll of the pupil's matchup with the given faces (one list per seat), with a fresh uuid v4 id. */
export function rollOf(pupil: TestPupil, faces: number[][], extra: Partial<RollPayload> = {}): RollPayload {
  return {
    id: uuidv4(),
    tally: pupil.state.run.tally,
    matchup: pupil.state.group.matchup!,
    faces,
    recordedAt: new Date().toISOString(),
    ...extra,
  };
}

/** A random legal roll of the pupil's matchup (faces drawn from its dice). */
export function randomRollOf(pupil: TestPupil, random: () => number = Math.random): RollPayload {
  const { run, group } = pupil.state;
  const faces = group.matchup!.map((dieIndex) =>
    Array.from({ length: run.dicePerPlayer }, () => run.dice[dieIndex].faces[Math.floor(random() * run.dice[dieIndex].faces.length)]),
  );
  return rollOf(pupil, faces);
}

export function record(pupil: TestPupil, roll: RollPayload): Promise<RollRecordAck> {
  return pupil.socket.emitWithAck(EVENTS.rollRecord, { token: pupil.token, roll });
}
