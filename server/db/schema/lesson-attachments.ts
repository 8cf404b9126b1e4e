import { index, integer, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { lesson } from "./lessons";
import { user } from "./users";

/** A worksheet or image attached to a lesson; the bytes live on disk under the uploads folder. */
export const lessonAttachment = pgTable(
  "lesson_attachment",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    lessonId: uuid("lesson_id")
      .notNull()
      .references(() => lesson.id, { onDelete: "cascade" }),
    fileName: text("file_name").notNull(),
    mimeType: text("mime_type").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    storageKey: text("storage_key").notNull().unique(),
    uploadedById: text("uploaded_by_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index("lesson_attachment_lesson_id_idx").on(table.lessonId)],
);
