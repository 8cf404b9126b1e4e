import { and, eq, or } from "drizzle-orm";
import { emptyLessonInput, LESSON_PHASES, lessonInputSchema, type LessonInput, type LessonPhaseName } from "@shared/schemas/lessons";
import type { Database } from "../server/db/client";
import { findLessonByOwnerAndTitle, insertLesson } from "../server/db/queries/lessons";
import { diceSet, lesson } from "../server/db/schema/index";
import { demoDiceSetNames, demoRunLesson, demoTeachers } from "./demo-scenario";

type DemoSetKey = keyof typeof demoDiceSetNames;
type DemoLesson = {
  ownerEmail: string;
  set: DemoSetKey;
  input: Partial<LessonInput> & Pick<LessonInput, "title" | "classGroup" | "status">;
};

/** Phase minutes and notes in glossary order; a phase without minutes is left out of the lesson. */
function phases(entries: Partial<Record<LessonPhaseName, [number, string]>>): LessonInput["phases"] {
  return LESSON_PHASES.map((phase) => {
    const entry = entries[phase];
    return entry ? { phase, included: true, minutes: entry[0], notes: entry[1] } : { phase, included: false, minutes: 0, notes: "" };
  });
}

const [tomasz, ada] = demoTeachers.filter((t) => t.role === "teacher").map((t) => t.email);
const priya = demoTeachers.find((t) => t.role === "head")!.email;

/** Our own demo lessons: each demo teacher has a draft, a ready and a taught lesson, across classes 8K and 9M. */
export const demoLessons: DemoLesson[] = [
  {
    ownerEmail: demoRunLesson.ownerEmail,
    set: "threeDice",
    input: {
      title: demoRunLesson.title,
      classGroup: demoRunLesson.classGroup,
      status: "taught",
      durationMinutes: 60,
      objectives: [
        { text: "Predict which die wins most often, then test the prediction by rolling.", curriculumCode: "EN-KS3-P1" },
        { text: "Explain why every die in the trio can be beaten.", curriculumCode: "7.SP.C.8b" },
      ],
      groups: 8,
      pupilsPerGroup: 3,
      rollsPerGroup: 30,
      phases: phases({
        Guess: [5, "Show the three dice; each pupil votes for the die they would pick."],
        Roll: [20, "Each group plays its assigned matchup; one pupil records, two roll. Swap roles every ten rolls."],
        Pool: [10, "Add each group's tallies on the board and compare them with the votes."],
        Prove: [15, "Draw the 6 × 6 grid for one matchup and count the winning cells."],
        Reflect: [10, "Discuss the prompts, then the exit ticket."],
      }),
      discussionPrompts: [
        "If you could choose second, which die would you pick, and why?",
        "Why did the pooled result look clearer than any one group's?",
      ],
      exitTicket: "Your friend picks a die first. Explain how you would choose yours.",
      differentiation: {
        support: "Give the grid for the first matchup already drawn.",
        stretch: "Find the chance the same die wins three rolls in a row.",
      },
    },
  },
  {
    ownerEmail: tomasz,
    set: "reversing",
    input: {
      title: "Two dice each: the Shearwater swap",
      classGroup: "9M",
      status: "ready",
      durationMinutes: 60,
      objectives: [
        { text: "Find the distribution of the sum of two dice from a table.", curriculumCode: "EN-KS4-P4" },
        { text: "Notice that the winner of a matchup can change when each player rolls two dice." },
      ],
      mode: { dicePerPlayer: 1, players: 2 },
      groups: 7,
      pupilsPerGroup: 4,
      rollsPerGroup: 24,
      phases: phases({
        Guess: [5, "Ask: if one die wins, will two of it still win?"],
        Roll: [15, "One die each first."],
        Pool: [5, "Pool the one-die results."],
        Twist: [15, "Same matchups with two dice each, faces summed."],
        Prove: [15, "Sum tables for both dice; compare the two chances."],
        Reflect: [5, "Exit ticket."],
      }),
      discussionPrompts: ["What changed when you rolled two dice?"],
      exitTicket: "Give one reason a die can win alone but lose in pairs.",
      differentiation: { support: "Sum table with the first row filled in.", stretch: "Predict what happens with three dice each." },
    },
  },
  {
    ownerEmail: tomasz,
    set: "fiveDice",
    input: {
      title: "Five petrels, one circle",
      classGroup: "8K",
      status: "draft",
      durationMinutes: 50,
      objectives: [{ text: "Use relative frequency to estimate which die beats which.", curriculumCode: "7.SP.C.6" }],
      groups: 5,
      pupilsPerGroup: 3,
      rollsPerGroup: 20,
      phases: phases({ Guess: [5, ""], Roll: [20, "Each group one matchup round the circle."], Pool: [10, ""], Reflect: [10, ""] }),
      discussionPrompts: [],
      exitTicket: "",
    },
  },
  {
    ownerEmail: ada,
    set: "reversing",
    input: {
      title: "Guess, then prove: the Shearwater swap",
      classGroup: "9M",
      status: "taught",
      durationMinutes: 55,
      objectives: [{ text: "Compare a theoretical probability with the class's experimental result.", curriculumCode: "7.SP.C.7" }],
      tieRule: "ties-score-half",
      groups: 6,
      pupilsPerGroup: 4,
      rollsPerGroup: 40,
      phases: phases({
        Guess: [5, "Quick show of hands."],
        Roll: [20, "Ties score half a point each: record them as T."],
        Pool: [10, ""],
        Prove: [15, "Two-way table of the faces."],
        Reflect: [5, ""],
      }),
      discussionPrompts: ["How close was the class to the exact fraction?"],
      exitTicket: "Write the exact chance for one matchup and what the class got.",
    },
  },
  {
    ownerEmail: ada,
    set: "threeDice",
    input: {
      title: "Fair or not? Tree diagrams with the Kittiwake trio",
      classGroup: "8K",
      status: "ready",
      durationMinutes: 60,
      objectives: [{ text: "Draw a tree diagram for two dice and read probabilities from it.", curriculumCode: "EN-KS3-P4" }],
      groups: 9,
      pupilsPerGroup: 3,
      rollsPerGroup: 30,
      phases: phases({
        Guess: [5, ""],
        Roll: [20, ""],
        Pool: [10, ""],
        Prove: [20, "Tree diagram on mini whiteboards."],
        Reflect: [5, ""],
      }),
      discussionPrompts: ["Is a game with these dice fair if you pick second?"],
      exitTicket: "Is this game fair? Explain with a probability.",
    },
  },
  {
    ownerEmail: ada,
    set: "fiveDice",
    input: {
      title: "Three players at the table",
      classGroup: "9M",
      status: "draft",
      durationMinutes: 60,
      objectives: [{ text: "Find the chance that one die beats both of two others.", curriculumCode: "HSS-CP.A.2" }],
      mode: { dicePerPlayer: 1, players: 3 },
      groups: 6,
      pupilsPerGroup: 3,
      rollsPerGroup: 30,
      phases: phases({ Guess: [5, ""], Roll: [25, "Three players: the highest roll scores."], Pool: [10, ""], Reflect: [10, ""] }),
    },
  },
  {
    ownerEmail: priya,
    set: "threeDice",
    input: {
      title: "Relative frequency settles down",
      classGroup: "9M",
      status: "taught",
      durationMinutes: 50,
      objectives: [{ text: "See relative frequency settle towards the exact probability as rolls pile up.", curriculumCode: "EN-KS4-P5" }],
      groups: 10,
      pupilsPerGroup: 3,
      rollsPerGroup: 30,
      phases: phases({ Guess: [5, ""], Roll: [20, ""], Pool: [15, "Plot the running share after each group reports."], Reflect: [10, ""] }),
      discussionPrompts: ["After how many rolls would you trust the result?"],
      exitTicket: "Why can a single group get the 'wrong' winner?",
    },
  },
  {
    ownerEmail: priya,
    set: "reversing",
    input: {
      title: "When two dice change the winner",
      classGroup: "8K",
      status: "ready",
      durationMinutes: 60,
      objectives: [{ text: "Compare the sum distributions of two dice rolled together.", curriculumCode: "7.SP.C.8a" }],
      mode: { dicePerPlayer: 2, players: 2 },
      groups: 8,
      pupilsPerGroup: 3,
      rollsPerGroup: 30,
      phases: phases({ Guess: [5, ""], Roll: [20, "Two dice each from the start."], Pool: [10, ""], Prove: [20, ""], Reflect: [5, ""] }),
    },
  },
  {
    ownerEmail: priya,
    set: "fiveDice",
    input: {
      title: "Conditional chances with five dice",
      classGroup: "9M",
      status: "draft",
      durationMinutes: 60,
      objectives: [{ text: "Work out P(win | no tie) from a two-way table.", curriculumCode: "HSS-CP.A.3" }],
      tieRule: "ties-score-nothing",
      groups: 5,
      pupilsPerGroup: 4,
      rollsPerGroup: 40,
      phases: phases({ Roll: [25, ""], Pool: [10, ""], Prove: [20, ""], Reflect: [5, ""] }),
    },
  },
];

/** A demo set by name: the owner's own, else one shared with the department; null while the dice sets are not seeded. */
async function demoSetId(db: Database, name: string, ownerId: string, departmentId: string): Promise<string | null> {
  const rows = await db
    .select({ id: diceSet.id, ownerId: diceSet.ownerId })
    .from(diceSet)
    .where(
      and(
        eq(diceSet.name, name),
        or(eq(diceSet.ownerId, ownerId), and(eq(diceSet.departmentId, departmentId), eq(diceSet.visibility, "department"))),
      ),
    );
  return (rows.find((row) => row.ownerId === ownerId) ?? rows[0])?.id ?? null;
}

/**
 * The demo lessons; looks each up by owner and title first, so a second run adds nothing. A lesson seeded before its dice
 * set existed gets the set linked on a later run.
 */
export async function seedLessons(db: Database, teachers: { departmentId: string; teacherIds: Map<string, string> }) {
  const ids: string[] = [];
  for (const demo of demoLessons) {
    const ownerId = teachers.teacherIds.get(demo.ownerEmail);
    if (!ownerId) throw new Error(`Demo lesson owner ${demo.ownerEmail} is not seeded.`);
    const setId = await demoSetId(db, demoDiceSetNames[demo.set], ownerId, teachers.departmentId);
    const existing = await findLessonByOwnerAndTitle(db, ownerId, demo.input.title);
    if (existing) {
      if (existing.diceSetId === null && setId !== null)
        await db.update(lesson).set({ diceSetId: setId }).where(eq(lesson.id, existing.id));
      ids.push(existing.id);
      continue;
    }
    const input = lessonInputSchema.parse({ ...emptyLessonInput(), ...demo.input, diceSetId: setId });
    const row = await insertLesson(db, { ownerId, departmentId: teachers.departmentId, input });
    ids.push(row.id);
  }
  return { lessonIds: ids };
}
