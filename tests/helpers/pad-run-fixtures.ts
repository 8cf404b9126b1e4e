// Browser tests of the Roll pad: an open class run made over HTTP by a demo teacher, so a phone has something to join.
import { request, type APIRequestContext } from "playwright-core";
import { emptyLessonInput } from "@shared/schemas/lessons";
import { demoPassword, demoRunLesson, demoTeachers } from "../../seed/demo-scenario";

// Invented dice for the pad's browser tests.
export const padTestDice = [
  { name: "Auk", faces: [1, 1, 5, 5, 6, 6], colour: "teal", pattern: "dots" },
  { name: "Razorbill", faces: [2, 3, 3, 4, 7, 7], colour: "amber", pattern: "stripes" },
  { name: "Guillemot", faces: [0, 4, 4, 4, 4, 8], colour: "plum", pattern: "checks" },
];

export type PadTestRun = { id: string; joinCode: string; teacher: APIRequestContext; phase: (phase: string) => Promise<void> };

/** Signs a demo teacher in over HTTP, makes a dice set and a lesson, opens a run of it and answers its id and join code. */
export async function openPadTestRun(appUrl: string): Promise<PadTestRun> {
  const headers = { origin: appUrl };
  const teacher = await request.newContext({ baseURL: appUrl, extraHTTPHeaders: headers });
  const owner = demoTeachers.find((entry) => entry.email === demoRunLesson.ownerEmail)!;
  const signIn = await teacher.post("/api/auth/sign-in/email", { data: { email: owner.email, password: demoPassword } });
  if (!signIn.ok()) throw new Error(`sign-in failed: ${signIn.status()}`);
  const set = await teacher.post("/api/dice-sets", {
    data: { name: `Sea-cliff three ${Date.now().toString(36)}`, description: "", visibility: "private", dice: padTestDice },
  });
  if (set.status() !== 201) throw new Error(`dice set: ${await set.text()}`);
  const lesson = await teacher.post("/api/lessons", {
    data: {
      ...emptyLessonInput(),
      title: `Pad run ${Date.now().toString(36)}`,
      classGroup: "8K",
      status: "ready",
      diceSetId: (await set.json()).id,
    },
  });
  if (lesson.status() !== 201) throw new Error(`lesson: ${await lesson.text()}`);
  const run = await teacher.post("/api/class-runs", {
    data: { lessonId: ((await lesson.json()) as { lesson: { id: string } }).lesson.id },
  });
  if (run.status() !== 201) throw new Error(`run: ${await run.text()}`);
  const { id, joinCode } = (await run.json()) as { id: string; joinCode: string };
  return {
    id,
    joinCode,
    teacher,
    phase: async (phase) => {
      const moved = await teacher.post(`/api/class-runs/${id}/phase`, { data: { phase } });
      if (!moved.ok()) throw new Error(`phase ${phase}: ${await moved.text()}`);
    },
  };
}
