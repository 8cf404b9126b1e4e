import type { Database } from "../server/db/client";
import { seedTeachers } from "./seed-teachers";

/** Loads the whole demo scenario; every step checks what is there first, so it can run at each start. */
export async function seedDemoData(db: Database) {
  const teachers = await seedTeachers(db);
  return { teachers };
}
