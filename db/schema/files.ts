import { integer, sqliteTable, text } from "drizzle-orm/sqlite-core";

/** Content-addressed files (logger files, certificates, pictures): the name on disk is the hash. */
export const storedFiles = sqliteTable("stored_file", {
  sha256: text("sha256").primaryKey(),
  size: integer("size").notNull(),
  mediaType: text("media_type").notNull(),
  /** The key inside the file store (lib/storage/blob-store.ts): `<2 hex>/<sha256>`, the same in a folder or a bucket. */
  path: text("path").notNull(),
  /** Set when the bytes were removed because nothing refers to them any more. */
  purgedAt: integer("purged_at", { mode: "timestamp_ms" }),
  createdAt: integer("created_at", { mode: "timestamp_ms" }).notNull().$defaultFn(() => new Date()),
});

export type StoredFileRow = typeof storedFiles.$inferSelect;
