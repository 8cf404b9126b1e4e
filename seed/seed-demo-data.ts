import type { Database } from "../server/db/client";
import { seedClassRuns } from "./seed-class-runs";
import { seedDiceSets } from "./seed-dice-sets";
import { seedLessons } from "./seed-lessons";
import { seedShelf } from "./seed-shelf";
import { seedTeachers } from "./seed-teachers";

/** Loads the whole demo scenario; every step checks what is there first, so it can run at each start. */
export async function seedDemoData(db: Database) {
  const teachers = await seedTeachers(db);
  const diceSets = await seedDiceSets(db, teachers);
  // Lessons link the demo dice sets by name, so this step stays after the dice sets step.
  const lessons = await seedLessons(db, teachers);
  // The shelf's demo templates are frozen copies of the head's demo lessons.
  const shelf = await seedShelf(db, teachers);
  // The demo class run copies the demo lesson and its set, so it comes after the lessons step.
  const classRuns = await seedClassRuns(db);
  return { teachers, diceSets, lessons, shelf, classRuns };
}
