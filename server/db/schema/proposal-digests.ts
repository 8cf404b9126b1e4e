import { date, integer, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { organization } from "./departments";
import { user } from "./users";

/**
 * One proposal digest e-mail sent to a head of department on one day (UTC); the unique index makes sure a head gets
 * at most one a day however many processes or schedulers call the digest.
 */
export const proposalDigest = pgTable(
  "proposal_digest",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    departmentId: text("department_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    headId: text("head_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    digestDay: date("digest_day").notNull(),
    proposalCount: integer("proposal_count").notNull(),
    sentAt: timestamp("sent_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [uniqueIndex("proposal_digest_head_department_day_idx").on(table.headId, table.departmentId, table.digestDay)],
);
