import { integer, sqliteTable, text, index } from "drizzle-orm/sqlite-core";

// Messages captured by the local SMTP sink (development, demo and tests only).
export const sinkMessages = sqliteTable(
  "sink_message",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    receivedAt: integer("received_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
    envelopeFrom: text("envelope_from"),
    envelopeTo: text("envelope_to").notNull(),
    subject: text("subject"),
    text: text("text"),
    html: text("html"),
    headers: text("headers", { mode: "json" }),
  },
  (t) => [index("sink_message_received_idx").on(t.receivedAt)],
);
