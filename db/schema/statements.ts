import { sql } from "drizzle-orm";
import {
  bigint,
  boolean,
  check,
  customType,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import { months } from "./months";
import { monthSnapshots } from "./snapshots";
import { organisations, users } from "./organisations";
import { sites } from "./sites";

/** PDF and PKCS#12 bytes: `bytea` in PostgreSQL, a Buffer in TypeScript (pg returns Buffers). */
export const bytea = customType<{ data: Buffer; driverData: Buffer }>({
  dataType: () => "bytea",
  toDriver: (value) => value,
  fromDriver: (value) => (Buffer.isBuffer(value) ? value : Buffer.from(value as Uint8Array)),
});

export const statementKindEnum = pgEnum("statement_kind", ["monthly", "annual", "cbam"]);
export const mailStatusEnum = pgEnum("mail_status", ["pending", "sent", "failed"]);

/**
 * An organisation's signing certificate (PKCS#12). The passphrase is never stored in clear:
 * `passphraseSealed` is AES-256-GCM under a key derived from SIGNING_SECRET (or AUTH_SECRET),
 * bound to the fingerprint so a sealed passphrase cannot be moved to another row.
 */
export const signingCertificates = pgTable(
  "signing_certificates",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organisationId: uuid("organisation_id")
      .notNull()
      .references(() => organisations.id, { onDelete: "restrict" }),
    label: text("label").notNull(),
    p12: bytea("p12").notNull(),
    passphraseSealed: text("passphrase_sealed").notNull(),
    subject: text("subject").notNull(),
    /** SHA-256 of the certificate's DER, lower-case hex: what verification matches on. */
    fingerprintSha256: text("fingerprint_sha256").notNull(),
    validFrom: timestamp("valid_from", { withTimezone: true }).notNull(),
    validTo: timestamp("valid_to", { withTimezone: true }).notNull(),
    uploadedBy: uuid("uploaded_by").references(() => users.id, { onDelete: "set null" }),
    active: boolean("active").notNull().default(false),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("signing_certificates_fingerprint_key").on(t.fingerprintSha256),
    // At most one certificate signs for an organisation at a time.
    uniqueIndex("signing_certificates_one_active").on(t.organisationId).where(sql`${t.active}`),
    check("signing_certificates_fingerprint_hex", sql`${t.fingerprintSha256} ~ '^[0-9a-f]{64}$'`),
  ],
);

/**
 * A signed statement as issued: the exact PDF bytes and their hash. Immutable (migration
 * statements_immutable): a correction is a new row with revision n+1, never an edit.
 * Foreign keys are RESTRICT because a cascading delete or SET NULL would be an edit too.
 */
export const statements = pgTable(
  "statements",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organisationId: uuid("organisation_id")
      .notNull()
      .references(() => organisations.id, { onDelete: "restrict" }),
    siteId: uuid("site_id")
      .notNull()
      .references(() => sites.id, { onDelete: "restrict" }),
    kind: statementKindEnum("kind").notNull(),
    /** "YYYY-MM" for monthly, "YYYY" for annual statements, "YYYY-MM..YYYY-MM" for communications of embedded emissions (cbam). */
    period: text("period").notNull(),
    monthId: uuid("month_id").references(() => months.id, { onDelete: "restrict" }),
    /** The frozen month the monthly statement was rendered from (null for annual statements and those signed before snapshots). */
    snapshotId: uuid("snapshot_id").references(() => monthSnapshots.id, { onDelete: "restrict" }),
    revision: integer("revision").notNull(),
    pdf: bytea("pdf").notNull(),
    sha256: text("sha256").notNull(),
    signerUserId: uuid("signer_user_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    /** Name and role as they were at signing, so the record reads the same forever. */
    signerName: text("signer_name").notNull(),
    signerRole: text("signer_role").notNull(),
    signedAt: timestamp("signed_at", { withTimezone: true }).notNull(),
    certificateFingerprint: text("certificate_fingerprint")
      .notNull()
      .references(() => signingCertificates.fingerprintSha256, { onDelete: "restrict" }),
    /** Key figures as displayed (strings with units), for lists and the verification page. */
    summary: jsonb("summary").$type<Record<string, string>>().notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("statements_sha256_key").on(t.sha256),
    uniqueIndex("statements_site_kind_period_revision_key").on(t.siteId, t.kind, t.period, t.revision),
    index("statements_org_idx").on(t.organisationId, t.signedAt),
    check("statements_sha256_hex", sql`${t.sha256} ~ '^[0-9a-f]{64}$'`),
    check("statements_revision_positive", sql`${t.revision} >= 1`),
    check(
      "statements_period_format",
      // kind compared as text: a value added to the enum cannot be used as a literal in the migration that adds it.
      sql`(${t.kind}::text = 'monthly' AND ${t.period} ~ '^[0-9]{4}-(0[1-9]|1[0-2])$') OR (${t.kind}::text = 'annual' AND ${t.period} ~ '^[0-9]{4}$') OR (${t.kind}::text = 'cbam' AND ${t.period} ~ '^[0-9]{4}-(0[1-9]|1[0-2])[.][.][0-9]{4}-(0[1-9]|1[0-2])$')`,
    ),
  ],
);

/**
 * Notifications written in the same transaction as the change they announce, sent later by
 * lib/mail/outbox.ts: a signature never waits for, nor is lost with, the mail server.
 */
export const mailOutbox = pgTable(
  "mail_outbox",
  {
    id: bigint("id", { mode: "number" }).primaryKey().generatedAlwaysAsIdentity(),
    to: text("to").notNull(),
    subject: text("subject").notNull(),
    text: text("text").notNull(),
    html: text("html").notNull(),
    status: mailStatusEnum("status").notNull().default("pending"),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: timestamp("next_attempt_at", { withTimezone: true }).notNull().defaultNow(),
    lastError: text("last_error"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp("sent_at", { withTimezone: true }),
  },
  (t) => [index("mail_outbox_due_idx").on(t.nextAttemptAt).where(sql`${t.status} = 'pending'`)],
);

export type SigningCertificateRow = typeof signingCertificates.$inferSelect;
export type StatementRow = typeof statements.$inferSelect;
export type MailOutboxRow = typeof mailOutbox.$inferSelect;
