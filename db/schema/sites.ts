import { bigint, boolean, date, index, integer, jsonb, numeric, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import type { InstallationIdentity } from "@/lib/validations/installation";
import { meteringReferenceEnum, streamKindEnum } from "./enums";
import { organisations } from "./organisations";

export const sites = pgTable(
  "sites",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organisationId: uuid("organisation_id")
      .notNull()
      .references(() => organisations.id, { onDelete: "restrict" }),
    name: text("name").notNull(),
    /** Short code used in URLs and file names, unique within the organisation. */
    code: text("code").notNull(),
    meteringReference: meteringReferenceEnum("metering_reference").notNull().default("15C"),
    /** Closure tolerance of the element balances, % (engine default 2). */
    closureTolerancePct: numeric("closure_tolerance_pct").notNull().default("2"),
    factorSet: text("factor_set").notNull().default("ipcc-2006"),
    emissionsMethod: text("emissions_method").notNull().default("carbon-mass-balance"),
    gwp: text("gwp").notNull().default("AR5"),
    /** The installation its statements are issued for (lib/validations/installation.ts); null until entered. */
    installation: jsonb("installation").$type<InstallationIdentity>(),
    archivedAt: timestamp("archived_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    /**
     * Changes whenever anything a site's figures are made of changes: the site itself, its
     * streams, months, readings, analyses or snapshots. Set by triggers (migration 0015), never by
     * the app, so a result kept in memory under it cannot outlive its data on any instance.
     */
    dataVersion: bigint("data_version", { mode: "number" }).notNull().default(0),
  },
  (t) => [uniqueIndex("sites_org_code_key").on(t.organisationId, t.code)],
);

/** A metered flow crossing the site boundary. Archived streams stay readable in old months. */
export const streams = pgTable(
  "streams",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    siteId: uuid("site_id")
      .notNull()
      .references(() => sites.id, { onDelete: "restrict" }),
    /** Identifier used in the plant-month file (`streams[].id`), unique within the site. */
    key: text("key").notNull(),
    name: text("name").notNull(),
    kind: streamKindEnum("kind").notNull(),
    unit: text("unit").notNull(),
    /** Which analysis gives the composition (gas streams), by analysis key. */
    analysisKey: text("analysis_key"),
    destination: text("destination"),
    fate: text("fate"),
    uncertaintyPct: numeric("uncertainty_pct"),
    /** False: no meter measures this flow; the reconciliation solves for it (an entered figure is an estimate). */
    metered: boolean("metered").notNull().default(true),
    /** Share of the meter's uncertainty that repeats every month until recalibration, %; null: 100 (all). */
    systematicPct: numeric("systematic_pct"),
    /** Indirect CO2 factor of an import or export: t CO2 per MWh (electricity) or per GJ (steam). */
    indirectFactor: numeric("indirect_factor"),
    meterTag: text("meter_tag"),
    calibratedOn: date("calibrated_on"),
    /** How often the site calibrates this meter, in months (its own rule); null: no interval set. */
    calibrationIntervalMonths: integer("calibration_interval_months"),
    sortOrder: integer("sort_order").notNull().default(0),
    archivedAt: timestamp("archived_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("streams_site_key_key").on(t.siteId, t.key), index("streams_site_idx").on(t.siteId)],
);
