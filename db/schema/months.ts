import { sql } from "drizzle-orm";
import { check, date, index, integer, jsonb, numeric, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { monthStateEnum, readingSourceEnum } from "./enums";
import { users } from "./organisations";
import { sites, streams } from "./sites";

/** One site's calendar month. `revision` grows on Reopen; `version` guards concurrent edits. */
export const months = pgTable(
  "months",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    siteId: uuid("site_id")
      .notNull()
      .references(() => sites.id, { onDelete: "restrict" }),
    /** Calendar month as "YYYY-MM". */
    period: text("period").notNull(),
    state: monthStateEnum("state").notNull().default("open"),
    revision: integer("revision").notNull().default(1),
    version: integer("version").notNull().default(1),
    /** The month's own method, factor set and GWP set: set from the site's defaults when the month is created. */
    emissionsMethod: text("emissions_method").notNull(),
    factorSet: text("factor_set").notNull(),
    gwp: text("gwp").notNull(),
    /** The last day the month's figures cover, when known (daily imports); null: not stated. */
    coveredThrough: date("covered_through"),
    /** Written reason when a balance is closed outside tolerance. */
    balanceNote: text("balance_note"),
    updatedBy: uuid("updated_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("months_site_period_key").on(t.siteId, t.period),
    check("months_period_format", sql`${t.period} ~ '^[0-9]{4}-(0[1-9]|1[0-2])$'`),
  ],
);

/** A monthly total of one stream. Quantities are kept as exact decimals (numeric). */
export const readings = pgTable(
  "readings",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    monthId: uuid("month_id")
      .notNull()
      .references(() => months.id, { onDelete: "cascade" }),
    streamId: uuid("stream_id")
      .notNull()
      .references(() => streams.id, { onDelete: "restrict" }),
    quantity: numeric("quantity").notNull(),
    unit: text("unit").notNull(),
    source: readingSourceEnum("source").notNull().default("meter"),
    note: text("note"),
    updatedBy: uuid("updated_by").references(() => users.id, { onDelete: "set null" }),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("readings_month_stream_key").on(t.monthId, t.streamId),
    check("readings_quantity_nonnegative", sql`${t.quantity} >= 0`),
  ],
);

/** A gas composition (mol %, dry) used by the month's streams, keyed as in the plant-month file. */
export const gasAnalyses = pgTable(
  "gas_analyses",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    monthId: uuid("month_id")
      .notNull()
      .references(() => months.id, { onDelete: "cascade" }),
    key: text("key").notNull(),
    /** Component → mol % as decimal strings, e.g. {"CH4": "93.10"}. */
    components: jsonb("components").$type<Record<string, string>>().notNull(),
    sampledOn: date("sampled_on"),
    laboratory: text("laboratory"),
    /** Expanded (95 %) relative uncertainty of the carbon content and of the calorific value, %; null: the set's default. */
    carbonUncertaintyPct: numeric("carbon_uncertainty_pct"),
    cvUncertaintyPct: numeric("cv_uncertainty_pct"),
    note: text("note"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("gas_analyses_month_key_key").on(t.monthId, t.key), index("gas_analyses_month_idx").on(t.monthId)],
);

export type MonthRow = typeof months.$inferSelect;
export type ReadingRow = typeof readings.$inferSelect;
export type GasAnalysisRow = typeof gasAnalyses.$inferSelect;

/**
 * A written explanation of one flag the engine raised for a month revision (by the process
 * engineer or the environmental officer), kept with the revision and printed on its statement.
 * Frozen with the month (trigger), like readings.
 */
export const flagNotes = pgTable(
  "flag_notes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    monthId: uuid("month_id")
      .notNull()
      .references(() => months.id, { onDelete: "cascade" }),
    revision: integer("revision").notNull(),
    code: text("code").notNull(),
    /** The stream the flag is about, or "" for a month-wide flag. */
    stream: text("stream").notNull().default(""),
    text: text("text").notNull(),
    writtenBy: uuid("written_by").references(() => users.id, { onDelete: "set null" }),
    writtenByName: text("written_by_name").notNull(),
    writtenRole: text("written_role").notNull(),
    writtenAt: timestamp("written_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("flag_notes_month_revision_code_stream_key").on(t.monthId, t.revision, t.code, t.stream)],
);
export type FlagNoteRow = typeof flagNotes.$inferSelect;
