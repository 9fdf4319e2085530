/**
 * The monthly ledger (issue 17): the running month and the twelve before it for every site, from
 * each site's first month on, each row with the figures of its month's run and who acts next;
 * a frozen month shows the figures of its snapshot, which equal those it was sent with.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { sites } from "@/db/schema";
import { ledgerRows } from "@/lib/ledger/ledger-rows";
import { currentMonthKey } from "@/lib/period";
import { closeTestDb, testDb } from "../support/db";
import { act, lifecycleOrg, type LifecycleOrg } from "./lifecycle-support";

vi.mock("@/auth", () => import("../support/mock-auth"));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined }));

let org: LifecycleOrg;
let newSiteId: string;
const now = new Date();

beforeAll(async () => {
  org = await lifecycleOrg("Ledger");
  const [row] = await testDb()
    .insert(sites)
    .values({ organisationId: org.id, name: "Newly set up works", code: "newworks", meteringReference: "15C", closureTolerancePct: "1.5", factorSet: "ipcc-2006", emissionsMethod: "carbon-mass-balance", gwp: "ar5" })
    .returning();
  newSiteId = row.id;
}, 90_000);
afterAll(closeTestDb);

describe("the monthly ledger", () => {
  it("covers the running month and the twelve before it, newest first, consecutive", async () => {
    const { months } = await ledgerRows(testDb(), org.id, now);
    expect(months).toHaveLength(13);
    expect(months[0]).toBe(currentMonthKey(now));
    for (let i = 1; i < months.length; i++) {
      const [y, m] = months[i - 1].split("-").map(Number);
      const prev = m === 1 ? `${y - 1}-12` : `${y}-${String(m - 1).padStart(2, "0")}`;
      expect(months[i]).toBe(prev);
    }
  });

  it("lists a site's months from its first stored month, and a new site's running month only", async () => {
    const { rows, months } = await ledgerRows(testDb(), org.id, now);
    const estuary = rows.filter((r) => r.siteId === org.estuaryId);
    // The demo scenario's months start in January 2026 (lib/demo/scenario.ts).
    expect(estuary.map((r) => r.month)).toEqual(months.filter((m) => m >= "2026-01"));
    const fresh = rows.filter((r) => r.siteId === newSiteId);
    expect(fresh).toEqual([
      expect.objectContaining({ month: months[0], state: null, stateLabel: "Not started", timing: "in-progress", tolerancePct: "1.5", next: { role: "process_engineer", todo: "enter figures as the days pass" } }),
    ]);
  });

  it("gives an ended Open month its closures, CO2e and intensity, and the engineer as next", async () => {
    const { rows, months } = await ledgerRows(testDb(), org.id, now);
    const row = rows.find((r) => r.siteId === org.estuaryId && r.month === months[1])!;
    expect(row).toMatchObject({ state: "open", timing: "ended", frozen: false, next: { role: "process_engineer", todo: "close the balance" } });
    for (const v of [row.closure.carbon, row.closure.nitrogen, row.closure.hydrogen, row.co2e_t, row.intensity, row.ammonia_t]) expect(v).toMatch(/^-?\d+(\.\d+)?$/);
    expect(Number(row.co2e_t)).toBeGreaterThan(0);
  });

  it("shows a month sent for sign-off as frozen with the signatory next and the same figures", async () => {
    const { rows, months } = await ledgerRows(testDb(), org.id, now);
    const before = rows.find((r) => r.siteId === org.estuaryId && r.month === months[1])!;
    await act(org, "process_engineer", org.estuaryId, before.month, "balance", { reason: "Closed for the ledger test." });
    await act(org, "environmental_officer", org.estuaryId, before.month, "send-for-review");
    const after = (await ledgerRows(testDb(), org.id, now)).rows.find((r) => r.siteId === org.estuaryId && r.month === before.month)!;
    expect(after).toMatchObject({ state: "in_review", stateLabel: "In review", frozen: true, revision: 1, next: { role: "signatory", todo: "sign or return" } });
    expect({ c: after.closure, e: after.co2e_t, i: after.intensity }).toEqual({ c: before.closure, e: before.co2e_t, i: before.intensity });
  });
});
