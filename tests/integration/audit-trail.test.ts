import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { recordAudit } from "@/db/queries/audit";
import { countAudit, searchAudit } from "@/db/queries/audit-trail";
import { eventDiff } from "@/components/audit/diff";
import { parseAuditFilter } from "@/lib/api/audit-filter";
import { trailFilter } from "@/lib/api/audit-csv";
import { ROLES } from "@/lib/auth/roles";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";
import { ctx, errorOf, request } from "./api-support";

vi.mock("@/auth", () => import("../support/mock-auth"));

const { GET } = await import("@/app/api/v1/audit/export/route");

let org: FixtureOrg;
let other: FixtureOrg;
const csv = (query = "") => GET(request("GET", `/api/v1/audit/export${query}`), ctx({}));
const lines = async (res: Response) => (await res.text()).replace(/^\uFEFF/, "").trimEnd().split("\r\n");

beforeAll(async () => {
  org = await createOrg(testDb(), "Audit");
  other = await createOrg(testDb(), "AuditOther");
  const base = { organisationId: org.id, siteId: org.siteId, actorUserId: org.members.process_engineer.id };
  await recordAudit(testDb(), { ...base, actorLabel: "Engineer, Lead", channel: "form", action: "reading.changed", entity: "reading", entityId: "2026-03/nh3", before: { quantity: "45000", unit: "t" }, after: { monthId: "x", stream: "nh3", version: 2, quantity: "45100", unit: "t" } });
  await recordAudit(testDb(), { ...base, actorLabel: "=HYPERLINK(\"evil\")", channel: "api-token", action: "reading.added", entity: "reading", entityId: "2026-03/power", after: { stream: "power", quantity: "9120.25", unit: "MWh" } });
  await recordAudit(testDb(), { ...base, actorLabel: "Admin", channel: "form", action: "api-token.created", entity: "api_token", entityId: "t1", after: { label: "DCS" } });
  await recordAudit(testDb(), { organisationId: other.id, actorLabel: "Someone else", channel: "form", action: "reading.added", entity: "reading" });
});
afterAll(closeTestDb);

describe("GET /api/v1/audit/export (CSV)", () => {
  it.each(ROLES)("gives %s the organisation's events with a header row, nothing of other organisations", async (role) => {
    actAs(org.session(role));
    const res = await csv();
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    expect(res.headers.get("content-disposition")).toMatch(/^attachment; filename="synledger-audit-\d{4}-\d{2}-\d{2}\.csv"$/);
    const rows = await lines(res);
    expect(rows[0]).toBe("id,at_utc,site,actor,channel,action,entity,entity_id,reason,before_json,after_json,organisation_id,site_id,actor_user_id,prev_hash,hash");
    expect(rows).toHaveLength(4);
    expect(rows.join("\n")).not.toContain("Someone else");
  });

  it("quotes commas and JSON, keeps decimal strings, and defuses formulas", async () => {
    actAs(org.session("auditor"));
    const rows = await lines(await csv("?entity=reading"));
    expect(rows).toHaveLength(3);
    const changed = rows.find((r) => r.includes("reading.changed"))!;
    expect(changed).toContain('"Engineer, Lead"');
    expect(changed).toContain('""quantity"":""45000""');
    const token = rows.find((r) => r.includes("api-token"))!;
    expect(token).toContain(`"'=HYPERLINK(""evil"")"`);
  });

  it("filters by channel, actor (any case, part of it), site and dates", async () => {
    actAs(org.session("auditor"));
    expect(await lines(await csv("?channel=api-token"))).toHaveLength(2);
    expect(await lines(await csv("?actor=engineer"))).toHaveLength(2);
    expect(await lines(await csv(`?site=${other.siteId}`))).toHaveLength(1);
    const today = new Date().toISOString().slice(0, 10);
    expect(await lines(await csv(`?from=${today}&to=${today}`))).toHaveLength(4);
    expect(await lines(await csv("?to=2000-01-01"))).toHaveLength(1);
  });

  it("400 with the field for a bad filter; 401 signed out", async () => {
    actAs(org.session("auditor"));
    const res = await csv("?channel=fax&from=2026-02-30");
    expect(res.status).toBe(400);
    expect((await errorOf(res)).issues?.map((i) => i.path).sort()).toEqual(["channel", "from"]);
    actAs(null);
    expect((await csv()).status).toBe(401);
  });
});

describe("audit trail query and paging", () => {
  it("pages newest first and counts the filtered events", async () => {
    const parsed = parseAuditFilter(new URLSearchParams("entity=reading&page=2"));
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    const f = trailFilter(parsed.filter);
    expect(await countAudit(testDb(), org.id, f)).toBe(2);
    const pageOne = await searchAudit(testDb(), org.id, f, { limit: 1, offset: 0 });
    const pageTwo = await searchAudit(testDb(), org.id, f, { limit: 1, offset: 1 });
    expect(pageOne[0].action).toBe("reading.added");
    expect(pageTwo[0]).toMatchObject({ action: "reading.changed", siteName: expect.stringContaining("Audit works") });
  });

  it("names the field of an impossible range, together with any other mistake", () => {
    expect(parseAuditFilter({ from: "2026-03-02", to: "2026-03-01" })).toEqual({ ok: false, issues: [{ path: "to", message: "to must not be before from" }] });
    const both = parseAuditFilter({ from: "2026-03-02", to: "2026-03-01", channel: "fax" });
    expect(both.ok ? [] : both.issues.map((i) => i.path)).toEqual(["channel", "to"]);
  });
});

describe("before → after as a person reads it", () => {
  it("shows what changed, names the record by its context fields and counts the rest", () => {
    expect(eventDiff({ quantity: "45000", unit: "t", source: "meter" }, { monthId: "m", stream: "nh3", version: 2, quantity: "45100", unit: "t", source: "meter" })).toEqual({
      rows: [{ field: "quantity", before: "45000", after: "45100", change: "changed" }],
      context: [{ field: "stream", value: "nh3" }, { field: "version", value: "2" }],
      unchanged: 2,
    });
  });
  it("reads a null field as empty: setting it is an addition, clearing it a removal", () => {
    expect(eventDiff({ note: null, quantity: "1" }, { stream: "nh3", note: "gauge", quantity: "1" }).rows).toEqual([{ field: "note", before: null, after: "gauge", change: "added" }]);
    expect(eventDiff({ note: "gauge" }, { note: null }).rows).toEqual([{ field: "note", before: "gauge", after: null, change: "removed" }]);
  });
  it("flattens nested values and marks additions and removals", () => {
    const d = eventDiff({ components: { CH4: "95.2", N2: "1" } }, { components: { CH4: "95.0", CO2: "1" } });
    expect(d.rows).toEqual([
      { field: "components.CH4", before: "95.2", after: "95.0", change: "changed" },
      { field: "components.N2", before: "1", after: null, change: "removed" },
      { field: "components.CO2", before: null, after: "1", change: "added" },
    ]);
    expect(eventDiff(null, { roles: ["auditor", "signatory"] }).rows).toEqual([{ field: "roles", before: null, after: "auditor, signatory", change: "added" }]);
  });
});
