import { sql } from "drizzle-orm";
import { check, index, integer, jsonb, numeric, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { months } from "./months";
import { organisations, users } from "./organisations";
import { sites } from "./sites";

/**
 * A month revision as it was sent for review: the plant-month document the engine read
 * (readings, analyses, the stream definitions and the method), the result document, both as
 * canonical JSON with their SHA-256, the engine's full calculation with exact decimals (what the
 * pages of a frozen month show), and the facts the statement prints. Append-only by trigger;
 * a revision sent back and sent again gets a new row (`seq` + 1). A signed statement names the
 * row it was rendered from.
 */
export const monthSnapshots = pgTable(
  "month_snapshots",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organisationId: uuid("organisation_id")
      .notNull()
      .references(() => organisations.id, { onDelete: "restrict" }),
    siteId: uuid("site_id")
      .notNull()
      .references(() => sites.id, { onDelete: "restrict" }),
    monthId: uuid("month_id")
      .notNull()
      .references(() => months.id, { onDelete: "restrict" }),
    period: text("period").notNull(),
    revision: integer("revision").notNull(),
    /** 1 for the first time the revision went In review, 2 after it was returned and sent again, … */
    seq: integer("seq").notNull(),
    engineVersion: text("engine_version").notNull(),
    closureTolerancePct: numeric("closure_tolerance_pct").notNull(),
    documentText: text("document_text").notNull(),
    documentSha256: text("document_sha256").notNull(),
    resultText: text("result_text").notNull(),
    resultSha256: text("result_sha256").notNull(),
    calculationText: text("calculation_text").notNull(),
    /** What the statement prints beside the figures: site, stream and analysis facts at freezing. */
    context: jsonb("context").notNull(),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "restrict" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("month_snapshots_month_revision_seq_key").on(t.monthId, t.revision, t.seq),
    index("month_snapshots_site_period_idx").on(t.siteId, t.period),
    check("month_snapshots_sha256_hex", sql`${t.documentSha256} ~ '^[0-9a-f]{64}$' AND ${t.resultSha256} ~ '^[0-9a-f]{64}$'`),
  ],
);

export type MonthSnapshotRow = typeof monthSnapshots.$inferSelect;
