/**
 * Flags are explained where they are raised (issue 17, item 8): the engineer or the officer
 * writes an explanation of a flag of the month's current revision; it shows on the review page,
 * is frozen with the revision and printed on the signed statement.
 */
import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { statementPdf } from "@/db/queries/statements";
import { flagNotes } from "@/db/schema";
import { loadReview } from "@/lib/lifecycle/review-data";
import { closeTestDb, testDb } from "../support/db";
import { actAs } from "../support/mock-auth";
import { act, lifecycleOrg, monthRow, type LifecycleOrg } from "./lifecycle-support";

vi.mock("@/auth", () => import("../support/mock-auth"));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined }));

const PERIOD = "2026-08"; // the demo's drift month: its carbon balance closes outside tolerance
const TEXT = "Feed meter EW-FQ-101 read high after the August shutdown; recalibration booked for September.";
let org: LifecycleOrg;
const { explainFlagAction } = await import("@/app/(app)/sites/[siteId]/months/[month]/review/actions");
const explain = (code: string, text: string, stream = "") => {
  const fd = new FormData();
  for (const [k, v] of Object.entries({ siteId: org.estuaryId, period: PERIOD, code, stream, text })) fd.set(k, v);
  return explainFlagAction(null, fd);
};

beforeAll(async () => {
  org = await lifecycleOrg("Flags");
}, 90_000);
afterAll(closeTestDb);

describe("explaining flags", () => {
  it("the engineer explains a raised flag; the review shows it with the author", async () => {
    actAs(org.session("process_engineer"));
    expect(await explain("carbon-closure-out-of-tolerance", TEXT)).toMatchObject({ ok: true });
    const review = await loadReview(testDb(), { organisationId: org.id, organisationName: org.name, userId: org.members.auditor.id }, org.estuaryId, PERIOD);
    const row = review!.model!.flags.find((f) => f.code === "carbon-closure-out-of-tolerance")!;
    expect(row).toMatchObject({ explanation: TEXT, explainedBy: expect.stringContaining("process engineer") });
  });

  it("a flag that is not raised, a short text, and the signatory are refused", async () => {
    actAs(org.session("environmental_officer"));
    expect(await explain("no-such-flag", TEXT)).toMatchObject({ ok: false, message: expect.stringContaining("not raised") });
    expect(await explain("carbon-closure-out-of-tolerance", "ok")).toMatchObject({ ok: false, message: expect.stringContaining("at least 10") });
    actAs(org.session("signatory"));
    expect(await explain("carbon-closure-out-of-tolerance", TEXT)).toMatchObject({ ok: false, message: expect.stringMatching(/^Your role does not allow you to explain flags/) });
  });

  it("is frozen with the revision and printed on the signed statement", async () => {
    await act(org, "process_engineer", org.estuaryId, PERIOD, "balance", { reason: "Feed meter drift; see the flag's explanation." });
    await act(org, "environmental_officer", org.estuaryId, PERIOD, "send-for-review");
    actAs(org.session("environmental_officer"));
    expect(await explain("carbon-closure-out-of-tolerance", `${TEXT} Again.`)).toMatchObject({ ok: false, message: expect.stringContaining("frozen") });
    const m = await monthRow(org.estuaryId, PERIOD);
    await expect(testDb().update(flagNotes).set({ text: "changed behind the app" }).where(eq(flagNotes.monthId, m.id))).rejects.toThrow();
    const out = await act(org, "signatory", org.estuaryId, PERIOD, "sign");
    const pdf = (await statementPdf(testDb(), { organisationId: org.id }, out.statementId!))!.pdf;
    const dir = mkdtempSync(join(tmpdir(), "flags-"));
    writeFileSync(join(dir, "s.pdf"), pdf);
    const text = execFileSync("pdftotext", [join(dir, "s.pdf"), "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
    expect(text).toContain("recalibration booked for September");
  });
});
