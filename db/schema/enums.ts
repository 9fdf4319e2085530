import { pgEnum } from "drizzle-orm/pg-core";
import { MONTH_STATES } from "../../lib/month-states";

/** Roles are held per organisation; one person may hold several (BRIEF.md, "Who uses it"). */
export const roleEnum = pgEnum("role", [
  "administrator",
  "process_engineer",
  "environmental_officer",
  "signatory",
  "auditor",
]);

/** Month life cycle: Open → Balanced → In review → Signed → Submitted. */
export const monthStateEnum = pgEnum("month_state", MONTH_STATES);

export const streamKindEnum = pgEnum("stream_kind", [
  "feed-gas",
  "fuel-gas",
  "purge-gas",
  "process-air",
  "ammonia",
  "co2-export",
  "co2-vent",
  "stack-co2",
  "electricity-import",
  "steam-import",
  "steam-export",
]);

/** Metering reference of a site: 15 °C (Sm3), 0 °C (Nm3) or 60 °F (scf). */
export const meteringReferenceEnum = pgEnum("metering_reference", ["15C", "0C", "60F"]);

export const readingSourceEnum = pgEnum("reading_source", ["meter", "estimate", "invoice"]);

/** Where a change came from, recorded with every audit event. */
export const channelEnum = pgEnum("channel", ["form", "import", "api-token", "system", "seed"]);
