import { index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { organization } from "./departments";
import { user } from "./users";

/** A Department shelf template: published by the head of department, copied by teachers. */
export const lessonTemplate = pgTable(
  "lesson_template",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    departmentId: text("department_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    title: text("title").notNull(),
    status: text("status", { enum: ["published", "retired"] })
      .notNull()
      .default("published"),
    currentVersion: integer("current_version").notNull().default(1),
    sourceLessonId: uuid("source_lesson_id"),
    createdById: text("created_by_id")
      .notNull()
      .references(() => user.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index("lesson_template_department_id_idx").on(table.departmentId)],
);

/** One frozen version of a template: a full copy of the lesson (and its dice set) with a change note. */
export const lessonTemplateVersion = pgTable(
  "lesson_template_version",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    templateId: uuid("template_id")
      .notNull()
      .references(() => lessonTemplate.id, { onDelete: "cascade" }),
    version: integer("version").notNull(),
    changeNote: text("change_note").notNull().default(""),
    snapshot: jsonb("snapshot").$type<Record<string, unknown>>().notNull(),
    publishedById: text("published_by_id")
      .notNull()
      .references(() => user.id),
    // The teacher whose approved proposal this version came from, credited beside the head who published it.
    proposedById: text("proposed_by_id").references(() => user.id, { onDelete: "set null" }),
    publishedAt: timestamp("published_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [uniqueIndex("lesson_template_version_template_version_idx").on(table.templateId, table.version)],
);

/** A teacher's proposal that one of their lessons go on the Department shelf; the head approves or declines. */
export const shelfProposal = pgTable(
  "shelf_proposal",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    departmentId: text("department_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    lessonId: uuid("lesson_id").notNull(),
    proposedById: text("proposed_by_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    note: text("note").notNull().default(""),
    status: text("status", { enum: ["pending", "approved", "declined"] })
      .notNull()
      .default("pending"),
    decidedById: text("decided_by_id").references(() => user.id),
    decisionNote: text("decision_note"),
    decidedAt: timestamp("decided_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index("shelf_proposal_department_status_idx").on(table.departmentId, table.status)],
);
