import { diceSetInputSchema, type DiceSetInput } from "@shared/schemas/dice-sets";
import type { Database } from "../server/db/client";
import { findOwnedDiceSetByName, insertDiceSet } from "../server/db/queries/dice-sets";
import { demoDiceSetNames, demoTeachers } from "./demo-scenario";

const tomasz = demoTeachers.find((teacher) => teacher.name === "Tomasz Reid")!.email;
const ada = demoTeachers.find((teacher) => teacher.name === "Ada Okafor")!.email;

/** A demo set, its owner, and the Set finder request its faces came from. */
export type DemoDiceSet = { ownerEmail: string; input: DiceSetInput; foundWith: string };

/**
 * The demo dice sets. Every set's faces were picked from the ranked results of our own Set finder (the request is beside each);
 * tests/shared/set-finder/demo-dice-sets.test.ts checks the claimed properties with the exact engine.
 */
export const demoDiceSets: DemoDiceSet[] = [
  {
    ownerEmail: tomasz,
    // Set finder: 3 dice, 6 faces, values 1 to 18, one cycle, no ties, strongest cycle, 50 results, 20 s, seed 11 (a 7/12 result whose
    // dice each carry three or more values).
    foundWith:
      '{"diceCount":3,"facesPerDie":6,"faceValues":{"kind":"range","min":1,"max":18},"property":"one-cycle","allowTies":false,"objective":"strongest-cycle","maxResults":50,"timeBudgetSeconds":20,"seed":11}',
    input: {
      name: demoDiceSetNames.threeDice,
      description:
        "Three six-faced dice in one cycle: Puffin beats Gannet, Gannet beats Skua and Skua beats Puffin, each with probability 7/12. No two dice share a face, so a roll never ties.",
      visibility: "department",
      dice: [
        { name: "Puffin", faces: [1, 1, 6, 6, 7, 11], colour: "teal", pattern: "dots" },
        { name: "Gannet", faces: [3, 3, 4, 4, 5, 10], colour: "amber", pattern: "stripes" },
        { name: "Skua", faces: [2, 2, 2, 8, 8, 9], colour: "plum", pattern: "checks" },
      ],
    },
  },
  {
    ownerEmail: tomasz,
    // Set finder: 3 dice, 6 faces, values 1 to 18, reversing cycle, no ties, strongest cycle, 50 results, 30 s, seed 21 (the strongest
    // result whose faces stay at 11 or below).
    foundWith:
      '{"diceCount":3,"facesPerDie":6,"faceValues":{"kind":"range","min":1,"max":18},"property":"reversing-cycle","allowTies":false,"objective":"strongest-cycle","maxResults":50,"timeBudgetSeconds":30,"seed":21}',
    input: {
      name: demoDiceSetNames.reversing,
      description:
        "With one die each Fulmar beats Tern, Tern beats Guillemot and Guillemot beats Fulmar. Roll two dice each and add: every one of those matchups turns round.",
      visibility: "department",
      dice: [
        { name: "Fulmar", faces: [1, 1, 7, 7, 7, 8], colour: "ocean", pattern: "rings" },
        { name: "Tern", faces: [5, 5, 5, 5, 6, 6], colour: "sand", pattern: "zigzags" },
        { name: "Guillemot", faces: [2, 2, 2, 3, 11, 11], colour: "moss", pattern: "crosses" },
      ],
    },
  },
  {
    ownerEmail: ada,
    // Set finder: 5 dice, 6 faces, values 1 to 15, two cycles, no ties, strongest cycle, 10 results, 60 s, seed 3 (its first result).
    foundWith:
      '{"diceCount":5,"facesPerDie":6,"faceValues":{"kind":"range","min":1,"max":15},"property":"two-cycles","allowTies":false,"objective":"strongest-cycle","maxResults":10,"timeBudgetSeconds":60,"seed":3}',
    input: {
      name: demoDiceSetNames.fiveDice,
      description:
        "Five dice, two cycles. Razorbill → Shag → Cormorant → Albatross → Eider → Razorbill keeps its direction with two dice each; " +
        "Razorbill → Cormorant → Eider → Shag → Albatross → Razorbill turns round with two dice each. Against any two opponents, some die and mode beats both.",
      visibility: "department",
      dice: [
        { name: "Razorbill", faces: [1, 8, 8, 8, 8, 11], colour: "teal", pattern: "dots" },
        { name: "Shag", faces: [4, 7, 7, 7, 7, 14], colour: "amber", pattern: "stripes" },
        { name: "Cormorant", faces: [5, 5, 5, 5, 13, 13], colour: "plum", pattern: "checks" },
        { name: "Albatross", faces: [3, 3, 3, 12, 12, 12], colour: "slate", pattern: "waves" },
        { name: "Eider", faces: [2, 2, 10, 10, 10, 10], colour: "coral", pattern: "triangles" },
      ],
    },
  },
  {
    ownerEmail: tomasz,
    // Set finder: 3 dice, 4 faces, values 1 to 9, one cycle, no ties, small faces (its first result: nothing above 6).
    foundWith:
      '{"diceCount":3,"facesPerDie":4,"faceValues":{"kind":"range","min":1,"max":9},"property":"one-cycle","allowTies":false,"objective":"small-faces"}',
    input: {
      name: "Gull starter (four faces)",
      description:
        "Tomasz's draft: three four-faced dice with faces no higher than 6, for a quick starter. Gull beats Booby 9/16, Booby beats Noddy 5/8, Noddy beats Gull 5/8.",
      visibility: "private",
      dice: [
        { name: "Gull", faces: [1, 4, 4, 4], colour: "coral", pattern: "triangles" },
        { name: "Booby", faces: [3, 3, 3, 6], colour: "slate", pattern: "waves" },
        { name: "Noddy", faces: [2, 2, 5, 5], colour: "ocean", pattern: "rings" },
      ],
    },
  },
];

/** The demo dice sets, each looked up by owner and name first, so a second run adds nothing. */
export async function seedDiceSets(db: Database, teachers: { departmentId: string; teacherIds: Map<string, string> }) {
  const ids: string[] = [];
  for (const demo of demoDiceSets) {
    const ownerId = teachers.teacherIds.get(demo.ownerEmail);
    if (!ownerId) throw new Error(`Demo dice set owner ${demo.ownerEmail} is not seeded.`);
    const input = diceSetInputSchema.parse(demo.input);
    const existing = await findOwnedDiceSetByName(ownerId, input.name, db);
    if (existing) {
      ids.push(existing.id);
      continue;
    }
    ids.push(await insertDiceSet({ ...input, ownerId, departmentId: teachers.departmentId }, db));
  }
  return { diceSetIds: ids };
}
