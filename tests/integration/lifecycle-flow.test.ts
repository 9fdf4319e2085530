import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { listAudit } from "@/db/queries/audit";
import { statementPdf } from "@/db/queries/statements";
import { memberships, months, statements } from "@/db/schema";
import { transitionMonth } from "@/lib/lifecycle/service";
import { runStoredMonth } from "@/lib/ledger/month-runs";
import { setMonthMethod } from "@/lib/ledger/month-method";
import { sha256Hex } from "@/lib/signing/hash";
import { verifyStatementPdf } from "@/lib/signing/verify";
import { fixed, signed } from "@/reports/format";
import { closeTestDb, testDb } from "../support/db";
import { act, lifecycleOrg, monthRow, refusal, type LifecycleOrg } from "./lifecycle-support";

let org: LifecycleOrg;
const dir = mkdtempSync(join(tmpdir(), "synledger-life-"));
const pdfText = (pdf: Buffer, name: string) => {
  const file = join(dir, name);
  writeFileSync(file, pdf);
  return execFileSync("pdftotext", [file, "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
};

beforeAll(async () => {
  org = await lifecycleOrg("Flow");
}, 90_000);
afterAll(closeTestDb);

describe("preconditions", () => {
  it("a drift month outside tolerance is refused without a reason, naming the balance", async () => {
    const err = await refusal(() => act(org, "process_engineer", org.estuaryId, "2026-08", "balance"));
    expect(err).toMatchObject({ status: 422, code: "precondition_failed" });
    expect(err.issues.map((i) => i.path)).toContain("balances.carbon");
    expect((await monthRow(org.estuaryId, "2026-08")).state).toBe("open");
  });

  it("a reason shorter than 10 characters is refused too", async () => {
    const err = await refusal(() => act(org, "process_engineer", org.estuaryId, "2026-08", "balance", { reason: "meter" }));
    expect(err.status).toBe(422);
  });

  it("with a written reason it closes, keeps the note and records closures in the audit trail", async () => {
    const reason = "Feed meter FT-101 drifted high after the August shutdown; calibration booked.";
    await act(org, "process_engineer", org.estuaryId, "2026-08", "balance", { reason });
    const m = await monthRow(org.estuaryId, "2026-08");
    expect(m).toMatchObject({ state: "balanced", balanceNote: reason });
    const [e] = (await listAudit(testDb(), org.id, { entity: "month" })).filter((x) => x.entityId === m.id);
    expect(e).toMatchObject({ action: "month.balance", reason, actorLabel: org.members.process_engineer.name });
    expect((e.after as { closures: Record<string, string> }).closures.carbon).toMatch(/^-?\d/);
  });

  it("In review needs the month's own method and factor set", async () => {
    await act(org, "process_engineer", org.estuaryId, "2026-02", "balance");
    const db = testDb();
    const m = await monthRow(org.estuaryId, "2026-02");
    await db.update(months).set({ factorSet: "", emissionsMethod: "" }).where(eq(months.id, m.id));
    const err = await refusal(() => act(org, "environmental_officer", org.estuaryId, "2026-02", "send-for-review"));
    expect(err.status).toBe(422);
    expect(err.issues.map((i) => i.path).sort()).toEqual(["emissions_method", "factor_set"]);
    // The site's defaults do not stand in: the month owns its choice, made by the officer.
    const again = await monthRow(org.estuaryId, "2026-02");
    await setMonthMethod(db, { organisationId: org.id, userId: org.members.environmental_officer.id, name: "officer" }, org.estuaryId, "2026-02", {
      emissions: "carbon-mass-balance",
      factor_set: "ipcc-2006",
      gwp: "AR5",
      expectedVersion: again.version,
    });
    await act(org, "environmental_officer", org.estuaryId, "2026-02", "send-for-review");
    expect((await monthRow(org.estuaryId, "2026-02")).state).toBe("in_review");
  });
});

describe("optimistic locking", () => {
  it("refuses a transition from a stale version and changes nothing", async () => {
    const m = await monthRow(org.estuaryId, "2026-04");
    await act(org, "process_engineer", org.estuaryId, "2026-04", "balance");
    const err = await refusal(() =>
      transitionMonth(testDb(), org.actor("environmental_officer"), { siteId: org.estuaryId, period: "2026-04", transition: "send-for-review", expectedVersion: m.version }),
    );
    expect(err).toMatchObject({ status: 409, code: "version_conflict" });
    expect((await monthRow(org.estuaryId, "2026-04")).state).toBe("balanced");
  });

  it("of two people acting on the same version at once, exactly one wins", async () => {
    const m = await monthRow(org.estuaryId, "2026-04");
    const input = { siteId: org.estuaryId, period: "2026-04", transition: "send-for-review" as const, expectedVersion: m.version };
    const results = await Promise.allSettled([
      transitionMonth(testDb(), org.actor("environmental_officer"), input),
      transitionMonth(testDb(), org.actor("environmental_officer"), input),
    ]);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    expect(results.find((r) => r.status === "rejected")).toMatchObject({ reason: { status: 409 } });
    expect((await monthRow(org.estuaryId, "2026-04")).version).toBe(m.version + 1);
  });
});

describe("sign, reopen, sign again", () => {
  let first: { id: string; pdf: Buffer; sha256: string };

  it("signs the statement from the engine result: figures with units in the PDF text", async () => {
    const period = "2026-03";
    await act(org, "process_engineer", org.estuaryId, period, "balance");
    await act(org, "environmental_officer", org.estuaryId, period, "send-for-review");
    const out = await act(org, "signatory", org.estuaryId, period, "sign");
    expect(out).toMatchObject({ state: "signed", revision: 1 });
    const stored = (await statementPdf(testDb(), { organisationId: org.id }, out.statementId!))!;
    first = { id: out.statementId!, pdf: stored.pdf, sha256: stored.sha256 };
    expect(sha256Hex(stored.pdf)).toBe(stored.sha256);

    const run = await runStoredMonth(testDb(), org.id, org.estuaryId, period);
    if (!run?.ok) throw new Error("month does not compute");
    const d = run.doc;
    const text = pdfText(stored.pdf, "rev1.pdf");
    for (const s of [
      `${fixed(d.emissions.gross_co2_t, 1)} t CO2`,
      `${fixed(d.emissions.net_co2_t, 1)} t CO2`,
      `${fixed(d.emissions_by_gas.ch4.co2e_t, 1)} t CO2e`,
      `${fixed(d.intensity.co2e_t_per_t_nh3, 3)} t CO2e/t NH3`,
      `${fixed(d.intensity.gj_lhv_per_t_nh3, 2)} GJ NCV/t NH3`,
      `${fixed(d.emissions.co2e_t, 1)} t CO2e`,
      "Declaration of the signatory",
      "EU ETS permit",
      `${signed(d.balances.carbon.closure_pct, 2)} %`,
      `${fixed(d.balances.carbon.in_kmol, 0)} kmol C`,
      "March 2026",
      out.statementId!,
      org.members.signatory.name,
    ]) {
      expect(text).toContain(s);
    }
    expect(text).toContain("only as good as the meters");
    const [row] = await testDb().select().from(statements).where(eq(statements.id, out.statementId!));
    expect(row).toMatchObject({ revision: 1, signerName: org.members.signatory.name, signerRole: "Signatory", period });
    expect((await verifyStatementPdf(testDb(), { organisationId: org.id }, stored.pdf)).verdict).toBe("issued");
  }, 60_000);

  it("a signed month cannot be balanced or edited by the engineer, nor reopened without a reason", async () => {
    expect((await refusal(() => act(org, "process_engineer", org.estuaryId, "2026-03", "balance"))).status).toBe(409);
    expect((await refusal(() => act(org, "signatory", org.estuaryId, "2026-03", "reopen", { reason: "  " }))).status).toBe(422);
  });

  it("records the submission with the authority's reference and date", async () => {
    const bad = await refusal(() => act(org, "environmental_officer", org.estuaryId, "2026-03", "record-submission", { reference: "", submittedOn: "2026-13-01" }));
    expect(bad.issues.map((i) => i.path)).toEqual(["reference", "submittedOn"]);
    await act(org, "environmental_officer", org.estuaryId, "2026-03", "record-submission", { reference: "EA/GHG/2026/0311", submittedOn: "2026-04-03" });
    const m = await monthRow(org.estuaryId, "2026-03");
    const e = (await listAudit(testDb(), org.id, { entity: "month" })).find((x) => x.entityId === m.id && x.action === "month.record-submission");
    expect(e?.after).toMatchObject({ reference: "EA/GHG/2026/0311", submittedOn: "2026-04-03", state: "submitted" });
  });

  it("reopen starts revision 2 and keeps the first PDF byte for byte; revision 2 signs as revision 2", async () => {
    const period = "2026-03";
    const reason = "Authority asked for the urea transfer to be split by destination.";
    const out = await act(org, "environmental_officer", org.estuaryId, period, "reopen", { reason });
    expect(out).toMatchObject({ state: "open", revision: 2 });
    expect((await monthRow(org.estuaryId, period)).balanceNote).toBeNull();

    await act(org, "process_engineer", org.estuaryId, period, "balance");
    await act(org, "environmental_officer", org.estuaryId, period, "send-for-review");
    const second = await act(org, "signatory", org.estuaryId, period, "sign");
    expect(second.revision).toBe(2);

    const again = (await statementPdf(testDb(), { organisationId: org.id }, first.id))!;
    expect(again.pdf.equals(first.pdf)).toBe(true);
    expect(again.sha256).toBe(first.sha256);
    const rows = await testDb().select({ revision: statements.revision, sha: statements.sha256 }).from(statements).where(and(eq(statements.siteId, org.estuaryId), eq(statements.period, period)));
    expect(rows.map((r) => r.revision).sort()).toEqual([1, 2]);
    const rev2 = (await statementPdf(testDb(), { organisationId: org.id }, second.statementId!))!;
    const text = pdfText(rev2.pdf, "rev2.pdf");
    expect(text).toContain(`Reopened: ${reason}`);
    expect(text).toContain("First issue");
  }, 90_000);

  it("the engineer who balanced a revision cannot also sign it (segregation of duties)", async () => {
    const both = org.members.process_engineer;
    await testDb().update(memberships).set({ roles: ["process_engineer", "signatory"] }).where(and(eq(memberships.userId, both.id), eq(memberships.organisationId, org.id)));
    const actor = { ...org.actor("process_engineer"), roles: ["process_engineer", "signatory"] as const };
    const run = async (t: "balance" | "sign") => {
      const m = await monthRow(org.estuaryId, "2026-05");
      return transitionMonth(testDb(), { ...actor, roles: [...actor.roles] }, { siteId: org.estuaryId, period: "2026-05", transition: t, expectedVersion: m.version });
    };
    await run("balance");
    await act(org, "environmental_officer", org.estuaryId, "2026-05", "send-for-review");
    const err = await refusal(() => run("sign"));
    expect(err).toMatchObject({ status: 403, code: "segregation_of_duties" });
    expect((await monthRow(org.estuaryId, "2026-05")).state).toBe("in_review");
    await act(org, "signatory", org.estuaryId, "2026-05", "sign");
  }, 60_000);
});
