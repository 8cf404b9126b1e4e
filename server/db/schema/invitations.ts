import { index, pgTable, text, timestamp } from "drizzle-orm/pg-core";
import { organization } from "./departments";
import { user } from "./users";

/** An e-mailed invitation to join a department; better-auth's organization invitation model. */
export const invitation = pgTable(
  "invitation",
  {
    id: text("id").primaryKey(),
    organizationId: text("organization_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    role: text("role"),
    status: text("status").notNull().default("pending"),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    inviterId: text("inviter_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
  },
  (table) => [index("invitation_organization_id_idx").on(table.organizationId), index("invitation_email_idx").on(table.email)],
);
