import { and, desc, eq, gt, inArray, max, sql, type SQL } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { signingCertificates, sites, statements, type SigningCertificateRow, type StatementRow } from "../schema";

type StatementKind = (typeof statements.$inferSelect)["kind"];

/** Every column but the PDF bytes: lists and verification never need to pull megabytes. */
const statementColumns = {
  id: statements.id,
  organisationId: statements.organisationId,
  siteId: statements.siteId,
  siteName: sites.name,
  siteCode: sites.code,
  kind: statements.kind,
  period: statements.period,
  monthId: statements.monthId,
  snapshotId: statements.snapshotId,
  revision: statements.revision,
  sha256: statements.sha256,
  signerUserId: statements.signerUserId,
  signerName: statements.signerName,
  signerRole: statements.signerRole,
  signedAt: statements.signedAt,
  certificateFingerprint: statements.certificateFingerprint,
  summary: statements.summary,
  createdAt: statements.createdAt,
};

export type StatementSummary = Omit<StatementRow, "pdf"> & { siteName: string; siteCode: string };

/** Certificate fields safe to show: never the PKCS#12 or its sealed passphrase. */
const certificateColumns = {
  id: signingCertificates.id,
  organisationId: signingCertificates.organisationId,
  label: signingCertificates.label,
  subject: signingCertificates.subject,
  fingerprintSha256: signingCertificates.fingerprintSha256,
  validFrom: signingCertificates.validFrom,
  validTo: signingCertificates.validTo,
  active: signingCertificates.active,
  uploadedBy: signingCertificates.uploadedBy,
  createdAt: signingCertificates.createdAt,
};

export type CertificateSummary = Omit<SigningCertificateRow, "p12" | "passphraseSealed">;

export async function insertSigningCertificate(tx: Db | Tx, row: typeof signingCertificates.$inferInsert): Promise<CertificateSummary> {
  const [created] = await tx.insert(signingCertificates).values(row).returning(certificateColumns);
  return created;
}

/** Makes one certificate the organisation's signing certificate; the partial unique index allows only one. */
export async function activateCertificate(tx: Db | Tx, organisationId: string, certificateId: string): Promise<boolean> {
  await tx
    .update(signingCertificates)
    .set({ active: false })
    .where(and(eq(signingCertificates.organisationId, organisationId), eq(signingCertificates.active, true)));
  const done = await tx
    .update(signingCertificates)
    .set({ active: true })
    .where(and(eq(signingCertificates.organisationId, organisationId), eq(signingCertificates.id, certificateId)))
    .returning({ id: signingCertificates.id });
  return done.length === 1;
}

/** The active certificate with its secret parts, for signing only (server side). */
export async function activeCertificateWithKey(tx: Db | Tx, organisationId: string) {
  const [row] = await tx
    .select()
    .from(signingCertificates)
    .where(and(eq(signingCertificates.organisationId, organisationId), eq(signingCertificates.active, true)));
  return row ?? null;
}

export async function listCertificates(db: Db, organisationId: string): Promise<CertificateSummary[]> {
  return db
    .select(certificateColumns)
    .from(signingCertificates)
    .where(eq(signingCertificates.organisationId, organisationId))
    .orderBy(desc(signingCertificates.createdAt));
}

/** A certificate by fingerprint, within one organisation, or among all (public verification: null). */
export async function certificateByFingerprint(db: Db | Tx, organisationId: string | null, fingerprint: string): Promise<CertificateSummary | null> {
  const byPrint = eq(signingCertificates.fingerprintSha256, fingerprint);
  const [row] = await db
    .select(certificateColumns)
    .from(signingCertificates)
    .where(organisationId ? and(eq(signingCertificates.organisationId, organisationId), byPrint) : byPrint)
    .limit(1);
  return row ?? null;
}

export async function insertStatement(tx: Db | Tx, row: typeof statements.$inferInsert): Promise<{ id: string }> {
  const [created] = await tx.insert(statements).values(row).returning({ id: statements.id });
  return created;
}

/**
 * Lookups within one organisation, optionally within granted sites; or, for public verification
 * by whoever holds a copy, among every stored statement (the answer then shows public facts only).
 */
export type StatementScope =
  | {
      organisationId: string;
      /** When set (e.g. an auditor granted some sites), statements of other sites count as not found. */
      siteIds?: string[];
    }
  | { anyOrganisation: true };

function scoped(scope: StatementScope, ...more: SQL[]): SQL | undefined {
  if ("anyOrganisation" in scope) return and(...more);
  const where = [eq(statements.organisationId, scope.organisationId), ...more];
  if (scope.siteIds) where.push(scope.siteIds.length ? inArray(statements.siteId, scope.siteIds) : sql`false`);
  return and(...where);
}

/** The newest later revision of the same site, kind and period, when the statement was superseded. */
export async function laterRevisionOf(db: Db | Tx, s: Pick<StatementSummary, "siteId" | "kind" | "period" | "revision">): Promise<StatementSummary | null> {
  const [row] = await db
    .select(statementColumns)
    .from(statements)
    .innerJoin(sites, eq(sites.id, statements.siteId))
    .where(and(eq(statements.siteId, s.siteId), eq(statements.kind, s.kind), eq(statements.period, s.period), gt(statements.revision, s.revision)))
    .orderBy(desc(statements.revision))
    .limit(1);
  return row ?? null;
}

async function findOne(db: Db | Tx, where: SQL | undefined): Promise<StatementSummary | null> {
  const [row] = await db.select(statementColumns).from(statements).innerJoin(sites, eq(sites.id, statements.siteId)).where(where);
  return row ?? null;
}

export function statementBySha256(db: Db | Tx, scope: StatementScope, sha256: string) {
  return findOne(db, scoped(scope, eq(statements.sha256, sha256)));
}

export function statementById(db: Db | Tx, scope: StatementScope, id: string) {
  return findOne(db, scoped(scope, eq(statements.id, id)));
}

export async function listStatements(
  db: Db,
  scope: StatementScope,
  f: { siteId?: string; kind?: StatementKind; period?: string } = {},
): Promise<StatementSummary[]> {
  const more: SQL[] = [];
  if (f.siteId) more.push(eq(statements.siteId, f.siteId));
  if (f.kind) more.push(eq(statements.kind, f.kind));
  if (f.period) more.push(eq(statements.period, f.period));
  return db
    .select(statementColumns)
    .from(statements)
    .innerJoin(sites, eq(sites.id, statements.siteId))
    .where(scoped(scope, ...more))
    .orderBy(desc(statements.period), desc(statements.revision));
}

/** The stored bytes for download, exactly as signed. */
export async function statementPdf(db: Db, scope: StatementScope, id: string): Promise<{ pdf: Buffer; sha256: string; fileName: string } | null> {
  const [row] = await db
    .select({ pdf: statements.pdf, sha256: statements.sha256, code: sites.code, kind: statements.kind, period: statements.period, revision: statements.revision })
    .from(statements)
    .innerJoin(sites, eq(sites.id, statements.siteId))
    .where(scoped(scope, eq(statements.id, id)));
  if (!row) return null;
  return { pdf: row.pdf, sha256: row.sha256, fileName: `${row.code}-${row.kind}-${row.period}-rev${row.revision}.pdf` };
}

/** Highest revision stored so far for a site's period, 0 when none. */
export async function latestRevision(db: Db | Tx, siteId: string, kind: StatementKind, period: string): Promise<number> {
  const [row] = await db
    .select({ n: max(statements.revision) })
    .from(statements)
    .where(and(eq(statements.siteId, siteId), eq(statements.kind, kind), eq(statements.period, period)));
  return row?.n ?? 0;
}
