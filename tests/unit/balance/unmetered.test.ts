// A flow no meter measures (issue 16): declared "metered": false, the reconciliation solves for it
// instead of moving good meters to absorb it. Weighted least-squares reconciliation with
// unmeasured flows eliminated by projection (Crowe, Garcia Campos & Hrymak 1983, AIChE J 29(6));
// the Šidák level for n simultaneous tests is c^(1/n) (Šidák 1967, JASA 62). The month is the
// demo's March at Estuary Works; its true vent is what the demo generator wrote.
import { describe, expect, it } from "vitest";
import { calculate } from "../../../lib/balance/calculate";
import { Dec } from "../../../lib/balance/decimal";
import { namedSuspects } from "../../../lib/balance/suspects";
import { parsePlantMonth, type PlantMonth } from "../../../lib/balance/schema";
import { demoPlantMonths, plantMonthJson } from "../../../lib/demo/scenario";

const march = demoPlantMonths("estuary").find((d) => d.month === "2026-03")!;
const trueVent = march.streams.find((s) => s.id === "co2-vent")!.quantity;

/** The month as a file would carry it, edited, then read back through the schema. */
function edited(edit: (streams: Record<string, unknown>[]) => Record<string, unknown>[]): PlantMonth {
  const json = JSON.parse(plantMonthJson(march));
  json.streams = edit(json.streams);
  const r = parsePlantMonth(json);
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r.doc;
}
const noVentMeter = (streams: Record<string, unknown>[]) =>
  streams.map((s) => (s.id === "co2-vent" ? { id: s.id, kind: s.kind, unit: s.unit, metered: false } : s));

describe("a month whose CO2 vent has no meter", () => {
  it("left out altogether, the balances cannot close and good meters take the blame (the failure the declaration removes)", () => {
    const r = calculate(edited((ss) => ss.filter((s) => s.id !== "co2-vent")));
    expect(r.reconciliation!.passed).toBe(false);
    expect(namedSuspects(r.reconciliation!.streams).length).toBeGreaterThan(0);
  });

  it("declared not metered: no meter is suspect, the vent is the unknown and the balances put it at its true value", () => {
    const r = calculate(edited(noVentMeter));
    const rec = r.reconciliation!;
    expect(rec.streams.map((s) => s.id)).not.toContain("co2-vent");
    expect(rec.streams.filter((s) => s.suspect)).toEqual([]);
    expect(r.flags.map((f) => f.code)).not.toContain("reconciliation-suspect-meter");
    const vent = rec.unmeasured.find((u) => u.stream === "co2-vent")!;
    expect(vent.observable).toBe(true);
    // Within 3 % of the generated vent: the other meters' own errors (each ≤ 5 % U95) move it.
    expect(vent.quantity!.minus(trueVent).abs().div(trueVent).lte("0.03"), `${vent.quantity} t vs ${trueVent} t`).toBe(true);
    // The solved value is the vent's quantity from then on: carbon closes through it.
    expect(r.streams.find((s) => s.id === "co2-vent")!.quantity.eq(vent.quantity!)).toBe(true);
    expect(r.flags.find((f) => f.code === "unmetered-stream-solved")?.stream).toBe("co2-vent");
  });

  it("is solved even where the caller skips reconciliation (a year's other rule sets, the what-if), and raises no missing-uncertainty warning", () => {
    const full = calculate(edited(noVentMeter));
    const quick = calculate(edited(noVentMeter), { reconcile: false });
    expect(quick.streams.find((s) => s.id === "co2-vent")!.quantity.eq(full.streams.find((s) => s.id === "co2-vent")!.quantity)).toBe(true);
    expect(full.flags.map((f) => f.code)).not.toContain("uncertainty-incomplete");
  });

  it("still names the one meter that is 5 % off (ammonia read high)", () => {
    const r = calculate(edited((ss) => noVentMeter(ss).map((s) => (s.id === "nh3" ? { ...s, quantity: new Dec(s.quantity as string).times("1.05").toFixed() } : s))));
    expect(r.reconciliation!.passed).toBe(false);
    expect(namedSuspects(r.reconciliation!.streams)).toEqual(["nh3"]);
  });

  it("with nothing else to fix it (no other carbon outlet), says the vent is unknown and uses the estimate", () => {
    const r = calculate(edited((ss) => ss.filter((s) => s.id !== "stack").map((s) => (s.id === "co2-vent" ? { ...s, metered: false, uncertainty_pct: undefined } : s))));
    const vent = r.reconciliation!.unmeasured.find((u) => u.stream === "co2-vent")!;
    expect(vent.observable).toBe(false);
    expect(r.flags.find((f) => f.code === "unmetered-stream-unknown")?.stream).toBe("co2-vent");
  });
});

describe("measurement tests are read only after the global test fails, at the Šidák level", () => {
  it("a good month names no meter; the critical value is the two-sided normal at 0.95^(1/n)", () => {
    const rec = calculate(march).reconciliation!;
    expect(rec.passed).toBe(true);
    expect(rec.streams.some((s) => s.suspect)).toBe(false);
    const n = rec.tested;
    expect(n).toBe(rec.streams.filter((s) => s.test_statistic !== null).length);
    // March has eight meters with a stated uncertainty. 0.95^(1/8) = 0.993609…; its two-sided normal
    // value 2.727008 (Python's statistics.NormalDist().inv_cdf(1 - (1 - 0.95 ** (1/8)) / 2)).
    expect(n).toBe(8);
    expect(rec.per_test_confidence.minus(new Dec("0.95").pow(new Dec(1).div(n))).abs().lte("1e-40")).toBe(true);
    expect(rec.z_critical.minus("2.727008").abs().lte("5e-7"), rec.z_critical.toFixed()).toBe(true);
  });

  it("a stream declared not metered must not carry a meter uncertainty, and only it may leave its quantity out", () => {
    const json = JSON.parse(plantMonthJson(march));
    json.streams[0] = { ...json.streams[0], quantity: undefined };
    json.streams[1] = { ...json.streams[1], metered: false };
    const r = parsePlantMonth(json);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues.map((i) => i.path)).toEqual(["streams[0].quantity", "streams[1].uncertainty_pct"]);
  });
});

describe("a site's stream set up as not metered reaches the engine as such", () => {
  const stream = (key: string, kind: string, unit: string, extra: Partial<import("../../../lib/ledger/month-document").StreamRow> = {}) => ({
    id: key, key, kind, unit, analysisKey: null, destination: null, fate: null, uncertaintyPct: "2", indirectFactor: null, meterTag: `FT-${key}`, sortOrder: 0, ...extra,
  });
  it("without a reading it is still in the document, marked not metered, with no meter facts", async () => {
    const { monthDocument } = await import("../../../lib/ledger/month-document");
    const doc = monthDocument({
      siteName: "Test", period: "2026-03", method: { emissions: "carbon-mass-balance", factor_set: "ipcc-2006", gwp: "AR5" },
      streams: [stream("nh3", "ammonia", "t"), stream("vent", "co2-vent", "t", { metered: false, uncertaintyPct: null, meterTag: null }), stream("sale", "co2-export", "t")],
      readings: [{ streamId: "nh3", quantity: "100", unit: "t", note: null }],
      analyses: [],
    });
    expect(doc.streams).toEqual([
      { id: "nh3", kind: "ammonia", quantity: "100", unit: "t", uncertainty_pct: "2", meter: "FT-nh3" },
      { id: "vent", kind: "co2-vent", unit: "t", metered: false },
    ]);
  });
});
