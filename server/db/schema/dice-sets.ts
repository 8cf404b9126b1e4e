import { index, integer, jsonb, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import type { SetDie } from "@shared/schemas/dice-sets";
import { organization } from "./departments";
import { user } from "./users";

/** A teacher's dice set: its dice live in one JSON column, checked by shared/schemas/dice-sets.ts on the way in. */
export const diceSet = pgTable(
  "dice_set",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    ownerId: text("owner_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    departmentId: text("department_id").references(() => organization.id, { onDelete: "set null" }),
    name: text("name").notNull(),
    description: text("description").notNull().default(""),
    visibility: text("visibility", { enum: ["private", "department"] })
      .notNull()
      .default("private"),
    dice: jsonb("dice").$type<SetDie[]>().notNull(),
    // Optimistic concurrency: an update must name the version it started from.
    version: integer("version").notNull().default(1),
    duplicatedFromId: uuid("duplicated_from_id"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    index("dice_set_owner_id_idx").on(table.ownerId),
    index("dice_set_department_visibility_idx").on(table.departmentId, table.visibility),
  ],
);
