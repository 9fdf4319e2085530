import { sql } from "drizzle-orm";
import { bigint, check, index, jsonb, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { channelEnum } from "./enums";
import { organisations, users } from "./organisations";

/**
 * Append-only record of every change: who, when, what, before → after, through which channel.
 * A trigger (migration 0001) refuses UPDATE, DELETE and TRUNCATE, whoever connects.
 */
export const auditEvents = pgTable(
  "audit_events",
  {
    id: bigint("id", { mode: "number" }).primaryKey().generatedAlwaysAsIdentity(),
    organisationId: uuid("organisation_id")
      .notNull()
      .references(() => organisations.id, { onDelete: "restrict" }),
    siteId: uuid("site_id"),
    actorUserId: uuid("actor_user_id").references(() => users.id, { onDelete: "set null" }),
    /** Name or token label as it was at the time, so the record reads even if the user goes. */
    actorLabel: text("actor_label").notNull(),
    channel: channelEnum("channel").notNull(),
    action: text("action").notNull(),
    entity: text("entity").notNull(),
    entityId: text("entity_id"),
    before: jsonb("before"),
    after: jsonb("after"),
    reason: text("reason"),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
    /** Hash chain per organisation (lib/audit/chain.ts): the previous event's hash (null for the first) and this event's. Null on events recorded before the chain began. */
    prevHash: text("prev_hash"),
    hash: text("hash"),
  },
  (t) => [
    index("audit_events_org_at_idx").on(t.organisationId, t.at),
    index("audit_events_entity_idx").on(t.entity, t.entityId),
    index("audit_events_org_id_idx").on(t.organisationId, t.id),
    check("audit_events_hash_hex", sql`${t.hash} IS NULL OR ${t.hash} ~ '^[0-9a-f]{64}$'`),
  ],
);
