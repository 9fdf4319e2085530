import { createHash, randomUUID } from "node:crypto";
import { months, signingCertificates, statements } from "@/db/schema";
import { ROLES } from "@/lib/auth/roles";
import { newMonth } from "../../support/fixtures";
import { type MatrixContext, type MatrixRow, matrixRequest } from "./types";

/** Rows of the life cycle, statements, verification and signing-certificate routes and actions. */
const PDF = Buffer.from("%PDF-1.4\n% matrix statement\n%%EOF\n");
const form = (fields: Record<string, string | Blob>) => {
  const fd = new FormData();
  for (const [k, v] of Object.entries(fields)) fd.set(k, v);
  return fd;
};

/** A stored certificate row (its bytes are never opened here) and a statement signed with it. */
async function storedStatement({ db, target }: MatrixContext, kind: "monthly" | "cbam" = "monthly"): Promise<string> {
  const fingerprint = createHash("sha256").update(randomUUID()).digest("hex");
  await db.insert(signingCertificates).values({
    organisationId: target.id,
    label: "matrix",
    p12: Buffer.from("not a real bundle"),
    passphraseSealed: "sealed",
    subject: "CN=Matrix",
    fingerprintSha256: fingerprint,
    validFrom: new Date(Date.now() - 86_400_000),
    validTo: new Date(Date.now() + 86_400_000),
  });
  const [row] = await db
    .insert(statements)
    .values({
      organisationId: target.id,
      siteId: target.siteId,
      kind,
      period: kind === "cbam" ? "2026-01..2026-03" : "2026-03",
      revision: 1,
      pdf: kind === "cbam" ? await communicationPdf() : PDF,
      sha256: createHash("sha256").update(PDF).update(randomUUID()).digest("hex"),
      signerUserId: target.members.signatory.id,
      signerName: "Matrix signatory",
      signerRole: "signatory",
      signedAt: new Date(),
      certificateFingerprint: fingerprint,
      summary: {},
    })
    .returning({ id: statements.id });
  return row.id;
}

/** A small real PDF carrying a communication document, as a signed communication does. */
async function communicationPdf(): Promise<Buffer> {
  const { PDFDocument } = await import("pdf-lib");
  const doc = await PDFDocument.create();
  doc.addPage();
  await doc.attach(new TextEncoder().encode('{"format":"synledger.cbam-communication/1"}'), "cbam-communication.json", { mimeType: "application/json" });
  return Buffer.from(await doc.save());
}

async function openMonth({ db, target }: MatrixContext) {
  const [m] = await db.insert(months).values(newMonth(target.siteId, "2026-03")).onConflictDoNothing().returning();
  return m?.version ?? 1;
}

export const lifecycleRows: MatrixRow[] = [
  {
    id: "GET /api/v1/statements/[id]/pdf",
    allowed: ROLES,
    call: async (ctx) => (await import("@/app/api/v1/statements/[id]/pdf/route")).GET(matrixRequest("http://matrix/"), { params: Promise.resolve({ id: await storedStatement(ctx) }) }),
  },
  {
    id: "GET /api/v1/statements/[id]/document",
    allowed: ROLES,
    call: async (ctx) => (await import("@/app/api/v1/statements/[id]/document/route")).GET(matrixRequest("http://matrix/"), { params: Promise.resolve({ id: await storedStatement(ctx, "cbam") }) }),
  },
  {
    // Public verification (issue 13): anyone holding a copy, no account; public facts only.
    id: "POST /api/v1/verify",
    allowed: "public",
    async call(ctx) {
      await storedStatement(ctx);
      return (await import("@/app/api/v1/verify/route")).POST(
        matrixRequest("http://matrix/", { method: "POST", body: PDF, headers: { "content-type": "application/pdf" } }),
        { params: Promise.resolve({}) },
      );
    },
  },
  {
    id: "app/(public)/verify/actions.ts#verifyAction",
    allowed: "public",
    async call(ctx) {
      await storedStatement(ctx);
      const { verifyAction } = await import("@/app/(public)/verify/actions");
      return verifyAction(null, form({ file: new File([PDF], "s.pdf", { type: "application/pdf" }) }));
    },
  },
  {
    // A file that is no PKCS#12 is refused after the gate, with a message on the field.
    id: "app/(app)/settings/signing/actions.ts#uploadCertificate",
    allowed: ["administrator"],
    call: async () =>
      (await import("@/app/(app)/settings/signing/actions")).uploadCertificate(
        null,
        form({ label: "matrix certificate", passphrase: "x", p12: new File([Buffer.from("junk")], "c.p12") }),
      ),
    // The upload lands in the uploader's own organisation; none of target's certificates change.
    async crossOrgSeesNothing(_result, { db, target }) {
      const rows = await db.select().from(signingCertificates);
      return !rows.some((r) => r.organisationId === target.id && r.label === "matrix certificate");
    },
  },
  {
    id: "app/(app)/settings/signing/actions.ts#activate",
    allowed: ["administrator"],
    async call(ctx) {
      const statementId = await storedStatement(ctx);
      const [s] = (await ctx.db.select().from(statements)).filter((x) => x.id === statementId);
      const [cert] = (await ctx.db.select().from(signingCertificates)).filter((c) => c.fingerprintSha256 === s.certificateFingerprint);
      return (await import("@/app/(app)/settings/signing/actions")).activate(null, form({ certificateId: cert.id }));
    },
  },
  {
    // The fixture month has no readings: an engineer's "balance" passes the gate and stops at its precondition.
    id: "app/(app)/sites/[siteId]/months/[month]/review/actions.ts#transitionAction",
    allowed: ["process_engineer"],
    async call(ctx) {
      const version = await openMonth(ctx);
      return (await import("@/app/(app)/sites/[siteId]/months/[month]/review/actions")).transitionAction(
        null,
        form({ siteId: ctx.target.siteId, period: "2026-03", transition: "balance", expectedVersion: String(version) }),
      );
    },
  },
  {
    id: "app/(app)/sites/[siteId]/months/[month]/review/actions.ts#setMonthMethodAction",
    allowed: ["environmental_officer", "administrator"],
    async call(ctx) {
      const version = await openMonth(ctx);
      return (await import("@/app/(app)/sites/[siteId]/months/[month]/review/actions")).setMonthMethodAction(
        null,
        form({ siteId: ctx.target.siteId, period: "2026-03", emissions: "fuel-calculation", factor_set: "eu-mrr", gwp: "AR5", expectedVersion: String(version) }),
      );
    },
  },
  {
    id: "app/(app)/sites/[siteId]/months/[month]/review/actions.ts#explainFlagAction",
    allowed: ["process_engineer", "environmental_officer"],
    async call(ctx) {
      await openMonth(ctx);
      return (await import("@/app/(app)/sites/[siteId]/months/[month]/review/actions")).explainFlagAction(
        null,
        form({ siteId: ctx.target.siteId, period: "2026-03", code: "missing-feed", stream: "", text: "The feed meter was out of service all month." }),
      );
    },
  },
];
