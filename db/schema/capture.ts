import { index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { organisations, users } from "./organisations";
import { sites, streams } from "./sites";
import { months } from "./months";
import { bytea } from "./statements";


/** Machine access for plant systems: per site, stored hashed, scoped to writing readings. */
export const apiTokens = pgTable(
  "api_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organisationId: uuid("organisation_id")
      .notNull()
      .references(() => organisations.id, { onDelete: "cascade" }),
    siteId: uuid("site_id")
      .notNull()
      .references(() => sites.id, { onDelete: "cascade" }),
    label: text("label").notNull(),
    /** First characters of the token, shown so people can tell tokens apart. */
    prefix: text("prefix").notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    scope: text("scope").notNull().default("readings:write"),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    lastUsedAt: timestamp("last_used_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("api_tokens_site_idx").on(t.siteId)],
);

/** Column mapping of a CSV layout, saved per site for the next import. */
export const importMappings = pgTable(
  "import_mappings",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    siteId: uuid("site_id")
      .notNull()
      .references(() => sites.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    /** e.g. { date: "Day", stream: "Tag", quantity: "Total", unit: "UoM" } or wide layouts. */
    mapping: jsonb("mapping").notNull(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("import_mappings_site_name_key").on(t.siteId, t.name)],
);

/** One committed import; the file's SHA-256 detects a second import of the same file. */
export const importBatches = pgTable(
  "import_batches",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    siteId: uuid("site_id")
      .notNull()
      .references(() => sites.id, { onDelete: "cascade" }),
    fileName: text("file_name").notNull(),
    fileSha256: text("file_sha256").notNull(),
    rowCount: integer("row_count").notNull(),
    summary: jsonb("summary"),
    importedBy: uuid("imported_by").references(() => users.id, { onDelete: "set null" }),
    importedAt: timestamp("imported_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("import_batches_site_sha_idx").on(t.siteId, t.fileSha256)],
);

/** Certificates and invoices attached to a month or a stream, kept in the database. */
export const attachments = pgTable(
  "attachments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organisationId: uuid("organisation_id")
      .notNull()
      .references(() => organisations.id, { onDelete: "cascade" }),
    siteId: uuid("site_id")
      .notNull()
      .references(() => sites.id, { onDelete: "cascade" }),
    monthId: uuid("month_id").references(() => months.id, { onDelete: "cascade" }),
    streamId: uuid("stream_id").references(() => streams.id, { onDelete: "cascade" }),
    category: text("category").notNull(),
    fileName: text("file_name").notNull(),
    /** Type detected from the content, not the name or the browser's claim. */
    mediaType: text("media_type").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    sha256: text("sha256").notNull(),
    content: bytea("content").notNull(),
    uploadedBy: uuid("uploaded_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("attachments_month_idx").on(t.monthId), index("attachments_stream_idx").on(t.streamId)],
);
