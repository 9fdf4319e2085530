/**
 * The audit trail as people read it (issue 17): a month taken through the life cycle, its method
 * chosen, a member disabled; the page's table names every record in words, shows no identifier
 * and no value beyond the display precision (closures to 2 decimals, computed figures to 6).
 */
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { AuditTable } from "@/components/audit/audit-table";
import { auditRecordLabels, searchAudit } from "@/db/queries/audit-trail";
import { setMonthMethod } from "@/lib/ledger/month-method";
import { closeTestDb, testDb } from "../support/db";
import { actAs } from "../support/mock-auth";
import { lifecycleOrg, monthRow, signThrough, type LifecycleOrg } from "./lifecycle-support";

vi.mock("@/auth", () => import("../support/mock-auth"));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined }));

let org: LifecycleOrg;
let text = "";

beforeAll(async () => {
  org = await lifecycleOrg("AuditWords");
  const m = await monthRow(org.estuaryId, "2026-06");
  await setMonthMethod(testDb(), { organisationId: org.id, userId: org.members.environmental_officer.id, name: "Officer" }, org.estuaryId, "2026-06", {
    emissions: "carbon-mass-balance",
    factor_set: "eu-mrr",
    gwp: "AR5",
    expectedVersion: m.version,
  });
  // August is the drift month: its balance closes outside tolerance, with a reason.
  await signThrough(org, org.estuaryId, "2026-08", "Feed meter drift after the August shutdown; calibration booked.");
  const { setMemberAccess } = await import("@/app/(app)/settings/users/actions");
  actAs(org.session("administrator"));
  const fd = new FormData();
  fd.set("userId", org.members.auditor.id);
  fd.set("access", "disable");
  await setMemberAccess(null, fd);
  const events = await searchAudit(testDb(), org.id, {}, { limit: 500, offset: 0 });
  const html = renderToStaticMarkup(createElement(AuditTable, { events, records: await auditRecordLabels(testDb(), org.id, events) }));
  text = html.replace(/<[^>]+>/g, " ").replace(/&[a-z#0-9]+;/g, " ").replace(/\s+/g, " ");
}, 120_000);
afterAll(closeTestDb);

describe("the audit table in words", () => {
  it("names months, statements and people instead of ids", () => {
    expect(text).toContain("Estuary Works · August 2026");
    expect(text).toMatch(/Monthly statement, Estuary Works · August 2026, revision 1/);
    expect(text).toContain(org.members.auditor.name);
    expect(text).toContain("sent for sign-off");
    expect(text).toContain("In review");
    expect(text).not.toMatch(/in_review|month\.send-for-review/);
  });

  it("shows no identifier", () => {
    expect(text).not.toMatch(/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/i);
  });

  it("shows closures to 2 decimals and no computed value beyond 6", () => {
    expect(text).toMatch(/carbon closure \(%\) set to [−+]?\d+\.\d{2}(?!\d)/);
    expect(text).not.toMatch(/\d\.\d{7,}/);
  });
});
