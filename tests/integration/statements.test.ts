import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { listAudit } from "@/db/queries/audit";
import { statementPdf } from "@/db/queries/statements";
import { createDemoCertificate } from "@/lib/signing/demo-certificate";
import { sha256Hex } from "@/lib/signing/hash";
import { issueStatement, registerCertificate, type SigningContext } from "@/lib/signing/issue";
import { sealPdf } from "@/lib/signing/seal";
import { statementReason } from "@/lib/signing/statement-ref";
import { verifyStatementPdf } from "@/lib/signing/verify";
import { renderMonthlyStatement } from "@/reports/render";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { sampleMonthly } from "../unit/signing/sample-models";

let org: FixtureOrg;
let other: FixtureOrg;
let issued: { id: string; sha256: string; signedAt: Date; pdf: Buffer };
let unsigned: Buffer;

const render = async (ctx: SigningContext) =>
  renderMonthlyStatement({
    ...sampleMonthly,
    header: { ...sampleMonthly.header, statementRef: ctx.statementId },
    signOff: { ...sampleMonthly.signOff, certificateSubject: ctx.certificateSubject, certificateFingerprint: ctx.certificateFingerprint, date: ctx.signedAt.toISOString() },
  });

async function pgError(run: () => Promise<unknown>): Promise<string> {
  try {
    await run();
  } catch (err) {
    const e = err as { cause?: { message?: string }; message: string };
    return e.cause?.message ?? e.message;
  }
  return "no error";
}

beforeAll(async () => {
  process.env.SIGNING_SECRET ??= "integration-test-signing-secret-0123456789";
  const db = testDb();
  org = await createOrg(db, "Sign");
  other = await createOrg(db, "Elsewhere");
  const admin = org.members.administrator;
  const demo = createDemoCertificate({ commonName: "Sign test statements", organisation: org.name, bits: 2048 });
  await registerCertificate(db, { organisationId: org.id, label: "Demo", ...demo, activate: true, actor: { userId: admin.id, name: admin.name } });
  const signer = org.members.signatory;
  issued = await issueStatement(db, {
    organisationId: org.id,
    siteId: org.siteId,
    kind: "monthly",
    period: "2026-03",
    revision: 1,
    signer: { userId: signer.id, name: signer.name, role: "Signatory" },
    location: "Estuary works",
    contactInfo: signer.email,
    summary: { netCo2: "39 162.5 t CO2" },
    render,
  });
  unsigned = await renderMonthlyStatement(sampleMonthly);
}, 60_000);
afterAll(closeTestDb);

describe("issuing a statement", () => {
  it("stores exactly the sealed bytes, with their hash and an audit record", async () => {
    const stored = await statementPdf(testDb(), { organisationId: org.id }, issued.id);
    expect(stored?.pdf.equals(issued.pdf)).toBe(true);
    expect(stored?.sha256).toBe(sha256Hex(issued.pdf));
    const events = await listAudit(testDb(), org.id, { entity: "statement" });
    expect(events.map((e) => [e.action, e.entityId])).toEqual([["statement.signed", issued.id]]);
  });
  it("refuses a second statement with the same revision, and leaves the first alone", async () => {
    const s = org.members.signatory;
    const err = await pgError(() =>
      issueStatement(testDb(), {
        organisationId: org.id, siteId: org.siteId, kind: "monthly", period: "2026-03", revision: 1,
        signer: { userId: s.id, name: s.name, role: "Signatory" }, location: "x", contactInfo: "x", summary: {}, render,
      }),
    );
    expect(err).toMatch(/statements_site_kind_period_revision_key/);
    const { rows } = await testDb().execute<{ n: number }>(sql`SELECT count(*)::int AS n FROM statements WHERE organisation_id = ${org.id}`);
    expect(rows[0].n).toBe(1);
  });
});

describe("a stored statement cannot be changed, even by the app's own database role", () => {
  it("refuses UPDATE of the PDF and of the signer", async () => {
    expect(await pgError(() => testDb().execute(sql`UPDATE statements SET pdf = '\\x00'::bytea WHERE id = ${issued.id}`))).toMatch(/append-only: UPDATE refused/);
    expect(await pgError(() => testDb().execute(sql`UPDATE statements SET signer_name = 'someone else' WHERE id = ${issued.id}`))).toMatch(/UPDATE refused/);
  });
  it("refuses DELETE and TRUNCATE", async () => {
    expect(await pgError(() => testDb().execute(sql`DELETE FROM statements WHERE id = ${issued.id}`))).toMatch(/append-only: DELETE refused/);
    expect(await pgError(() => testDb().execute(sql`TRUNCATE statements`))).toMatch(/(append-only|permission denied)/);
  });
  it("the app role cannot drop the trigger", async () => {
    expect(await pgError(() => testDb().execute(sql`DROP TRIGGER statements_immutable ON statements`))).toMatch(/must be owner/);
  });
  it("the bytes are still those issued", async () => {
    const { rows } = await testDb().execute<{ h: string }>(sql`SELECT encode(sha256(pdf), 'hex') AS h FROM statements WHERE id = ${issued.id}`);
    expect(rows[0].h).toBe(issued.sha256);
  });
});

describe("verifying an uploaded PDF", () => {
  const scope = () => ({ organisationId: org.id });

  it("the exact file is issued, with site, period, revision, signer and time", async () => {
    const v = await verifyStatementPdf(testDb(), scope(), issued.pdf);
    expect(v.verdict).toBe("issued");
    if (v.verdict !== "issued") return;
    expect(v.statement).toMatchObject({ id: issued.id, siteId: org.siteId, period: "2026-03", revision: 1, signerName: org.members.signatory.name });
    expect(v.statement.signedAt.toISOString()).toBe(issued.signedAt.toISOString());
    expect(v.signature?.signedDigestOk).toBe(true);
  });

  it("one changed byte anywhere makes it altered, never issued", async () => {
    const positions = new Set<number>([0, 9, issued.pdf.length - 1]);
    for (let i = 1; i < 24; i++) positions.add(Math.floor((issued.pdf.length * i) / 24));
    const text = issued.pdf.toString("latin1");
    // Just inside the signature's own parts: the range numbers, the PKCS#7 hex, the statement ref.
    for (const marker of ["/ByteRange [", "/Contents <", "/Reason (Synledger statement "]) positions.add(text.lastIndexOf(marker) + marker.length);
    positions.add(text.lastIndexOf("%%EOF") + 2);
    for (const at of positions) {
      const copy = Buffer.from(issued.pdf);
      copy[at] = copy[at] === 0x30 ? 0x31 : 0x30; // a digit: stays plausible inside hex strings and numbers
      expect(copy.equals(issued.pdf), `byte ${at} was not changed`).toBe(false);
      const v = await verifyStatementPdf(testDb(), scope(), copy);
      expect(v.verdict, `byte ${at} of ${copy.length}`).toBe("altered");
      if (v.verdict === "altered" && at < (v.signature.byteRange[1] ?? 0)) expect(v.signature.signedDigestOk, `byte ${at}`).toBe(false);
    }
  });

  it("a changed byte in the signed content reports the failed digest and the statement it claims to be", async () => {
    const copy = Buffer.from(issued.pdf);
    copy[200] ^= 0x01;
    const v = await verifyStatementPdf(testDb(), scope(), copy);
    expect(v.verdict).toBe("altered");
    if (v.verdict !== "altered") return;
    expect(v.claimed?.id).toBe(issued.id);
    expect(v.certificate?.label).toBe("Demo");
    expect(v.reasons.join(" ")).toMatch(/changed after signing/);
  });

  it("an unsigned PDF is unknown", async () => {
    const v = await verifyStatementPdf(testDb(), scope(), unsigned);
    expect(v).toMatchObject({ verdict: "unknown", reason: "The file carries no digital signature." });
  });

  it("a PDF signed with a certificate we never issued is unknown", async () => {
    const stranger = createDemoCertificate({ commonName: "Someone else", organisation: "Not us", bits: 2048 });
    const pdf = await sealPdf(unsigned, stranger.p12, stranger.passphrase, { reason: "approval", location: "x", name: "x", contactInfo: "x" });
    expect((await verifyStatementPdf(testDb(), scope(), pdf)).verdict).toBe("unknown");
  });

  it("a stranger's signature over a copy that names our statement is altered", async () => {
    const stranger = createDemoCertificate({ commonName: "Forger", organisation: "Not us", bits: 2048 });
    const pdf = await sealPdf(unsigned, stranger.p12, stranger.passphrase, { reason: statementReason(issued.id, "re-signed"), location: "x", name: "x", contactInfo: "x" });
    const v = await verifyStatementPdf(testDb(), scope(), pdf);
    expect(v.verdict).toBe("altered");
    if (v.verdict === "altered") expect(v.certificate).toBeNull();
  });

  it("someone of another organisation gets unknown for our exact file and for a tampered copy", async () => {
    expect((await verifyStatementPdf(testDb(), { organisationId: other.id }, issued.pdf)).verdict).toBe("unknown");
    const copy = Buffer.from(issued.pdf);
    copy[200] ^= 0x01;
    expect((await verifyStatementPdf(testDb(), { organisationId: other.id }, copy)).verdict).toBe("unknown");
  });

  it("an auditor granted only other sites gets unknown; granted this site, issued", async () => {
    expect((await verifyStatementPdf(testDb(), { organisationId: org.id, siteIds: [] }, issued.pdf)).verdict).toBe("unknown");
    expect((await verifyStatementPdf(testDb(), { organisationId: org.id, siteIds: [org.siteId] }, issued.pdf)).verdict).toBe("issued");
  });
});
