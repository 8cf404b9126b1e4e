import { db, pool } from "../server/db/client";
import { runMigrations } from "../server/db/migrate";
import { demoPassword, demoTeachers } from "./demo-scenario";
import { seedDemoData } from "./seed-demo-data";

await runMigrations(pool);
await seedDemoData(db);
await pool.end();

console.log("Demo data is in place. Demo sign-ins (password for each: %s):", demoPassword);
for (const teacher of demoTeachers) {
  console.log(`  ${teacher.email.padEnd(38)} ${teacher.role === "head" ? "head of department" : "teacher"}`);
}
