import { pool } from "./client";
import { runMigrations } from "./migrate";

await runMigrations(pool);
await pool.end();
console.log("Migrations applied.");
