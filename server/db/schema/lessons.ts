import { index, integer, jsonb, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { organization } from "./departments";
import { diceSet } from "./dice-sets";
import { user } from "./users";

/**
 * A teacher's lesson plan. Columns hold what the Lessons list searches and filters on; the rest of the plan
 * (objectives, phases, mode, groups, prompts, differentiation) is one JSON document checked by shared/schemas/lessons.ts.
 */
export const lesson = pgTable(
  "lesson",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    ownerId: text("owner_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    departmentId: text("department_id").references(() => organization.id, { onDelete: "set null" }),
    title: text("title").notNull(),
    classGroup: text("class_group").notNull().default(""),
    status: text("status", { enum: ["draft", "ready", "taught"] })
      .notNull()
      .default("draft"),
    diceSetId: uuid("dice_set_id").references(() => diceSet.id, { onDelete: "set null" }),
    plan: jsonb("plan").$type<Record<string, unknown>>().notNull(),
    version: integer("version").notNull().default(1),
    // Set when the lesson was copied from a Department shelf template.
    fromTemplateId: uuid("from_template_id"),
    fromTemplateVersion: integer("from_template_version"),
    archivedAt: timestamp("archived_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index("lesson_owner_id_idx").on(table.ownerId), index("lesson_department_id_idx").on(table.departmentId)],
);
