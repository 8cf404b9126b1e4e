import { bigserial, customType, pgTable, timestamp } from "drizzle-orm/pg-core";

const bytea = customType<{ data: Buffer }>({ dataType: () => "bytea" });

/** Where @socket.io/postgres-adapter keeps broadcasts too large for one NOTIFY (its own layout; rows live 30 s). */
export const socketIoAttachment = pgTable("socket_io_attachments", {
  id: bigserial("id", { mode: "number" }).unique(),
  createdAt: timestamp("created_at", { withTimezone: true }).defaultNow(),
  payload: bytea("payload"),
});
