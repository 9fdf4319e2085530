// The CLI against its published contract: shared/product/plant-month-format.md, section "What
// `npm run balance -- FILE --json` prints (stable keys; extra keys are welcome)". The key list
// below is that section's JSON example, key for key.
import { readdirSync } from "node:fs";
import { join } from "node:path";
import DecimalBase from "decimal.js";
import { describe, expect, it } from "vitest";
import { runCli } from "../../../lib/balance/cli";
import { demoPlantMonths, plantMonthJson } from "../../../lib/demo/scenario";
import { runCliProcess, writeTemp } from "./helpers";

const NUMBER_TEXT = /^-?\d+(\.\d+)?$/; // a decimal string, never exponent notation

const CONTRACT = {
  top: ["format", "streams", "balances", "synthesis", "emissions", "intensity", "flags"],
  stream: ["id", "kmol", "t", "carbon_t", "gj_lhv", "gj_hhv"],
  carbon: ["in_kmol", "out_kmol", "closure_pct"],
  nitrogen: ["in_kmol", "out_kmol", "closure_pct"],
  hydrogen: ["available_kmol", "used_kmol", "closure_pct"],
  synthesis: ["h2_n2_ratio"],
  emissions: ["co2_t", "ch4_t", "n2o_t", "co2e_t", "transferred_co2_t"],
  intensity: ["co2e_t_per_t_nh3", "gj_lhv_per_t_nh3"],
  flag: ["code", "severity", "message"],
};

/** A documented number: a decimal string, or null where the format allows it (said beside each call). */
function expectNumber(v: unknown, where: string, nullable = false) {
  if (nullable && v === null) return;
  expect(typeof v, where).toBe("string");
  expect(v as string, where).toMatch(NUMBER_TEXT);
}

const examples = readdirSync("examples").filter((f) => f.endsWith(".json"));
const good = examples.filter((f) => !f.startsWith("bad-"));

describe.each(good)("npm run balance -- examples/%s --json", (name) => {
  const r = runCli([join("examples", name), "--json"]);
  const doc = JSON.parse(r.stdout);

  it("exits 0 with nothing on stderr", () => expect([r.code, r.stderr]).toEqual([0, ""]));
  it("prints every documented key, numbers as strings", () => {
    for (const k of CONTRACT.top) expect(doc, k).toHaveProperty(k);
    expect(doc.format).toBe("synledger.result/1");
    for (const s of doc.streams) {
      for (const k of CONTRACT.stream) expect(s, `${s.id}.${k}`).toHaveProperty(k);
      // the engine contract: kmol, t and carbon are null for electricity and steam; gj only on combustible gas
      const material = !["electricity-import", "steam-import", "steam-export"].includes(s.kind);
      expectNumber(s.kmol, `${s.id}.kmol`, !material);
      expectNumber(s.t, `${s.id}.t`, !material);
      expectNumber(s.carbon_t, `${s.id}.carbon_t`, true);
      expectNumber(s.gj_lhv, `${s.id}.gj_lhv`, !["feed-gas", "fuel-gas", "purge-gas"].includes(s.kind));
    }
    for (const b of ["carbon", "nitrogen", "hydrogen"] as const)
      for (const k of CONTRACT[b]) expectNumber(doc.balances[b][k], `balances.${b}.${k}`, k === "closure_pct");
    for (const k of CONTRACT.synthesis) expectNumber(doc.synthesis[k], `synthesis.${k}`);
    for (const k of CONTRACT.emissions) expectNumber(doc.emissions[k], `emissions.${k}`);
    for (const k of CONTRACT.intensity) expectNumber(doc.intensity[k], `intensity.${k}`);
    for (const f of doc.flags) {
      for (const k of CONTRACT.flag) expect(typeof f[k]).toBe("string");
      expect(["info", "warning", "error"]).toContain(f.severity);
    }
  });
  it("no JSON number anywhere except the ordinal counts dof and tier", () => {
    const numbers: string[] = [];
    const walk = (v: unknown, path: string) => {
      if (typeof v === "number") numbers.push(path);
      else if (v && typeof v === "object") for (const [k, x] of Object.entries(v)) walk(x, `${path}.${k}`);
    };
    walk(doc, "$");
    expect(numbers.filter((p) => !/\.(dof|tier|meters_tested)$/.test(p))).toEqual([]);
  });
  it("closure_pct is null exactly where the format says: then an info flag explains it", () => {
    if (doc.balances.carbon.closure_pct === null) expect(doc.flags.map((f: { code: string }) => f.code)).toContain("carbon-closure-open");
    else expect(doc.flags.map((f: { code: string }) => f.code)).not.toContain("carbon-closure-open");
  });
});

describe("a bad example", () => {
  it.each(examples.filter((f) => f.startsWith("bad-")))("examples/%s: exit 2, nothing on stdout, the file and JSON path on stderr", (name) => {
    const r = runCli([join("examples", name), "--json"]);
    expect([r.code, r.stdout]).toEqual([2, ""]);
    expect(r.stderr).toContain(`examples/${name}`);
    expect(r.stderr).toMatch(/streams\[\d+\]\.\w+: /);
  });
});

describe("--year on the twelve demo months of Estuary Works", () => {
  const D = DecimalBase.clone({ precision: 40 });
  const docs = demoPlantMonths("estuary");
  const files = writeTemp("year", Object.fromEntries(docs.map((d) => [`estuary-${d.month}.json`, plantMonthJson(d)])));
  const monthly = files.map((f) => JSON.parse(runCli([f, "--json"]).stdout));
  const total = (pick: (m: ReturnType<typeof JSON.parse>) => string) => monthly.reduce((a, m) => a.plus(pick(m)), new D(0));
  const close = (a: string, b: DecimalBase) => new D(a).minus(b).abs().lte(b.abs().times("1e-13"));

  it("as users run it (tsx process): annual totals equal the sums of the monthly --json figures", async () => {
    const r = await runCliProcess(["--year", ...files, "--json"]);
    expect([r.code, r.stderr]).toEqual([0, ""]);
    const y = JSON.parse(r.stdout);
    expect(y.format).toBe("synledger.year-result/1");
    expect([y.site, y.year, y.months_included.length, y.months_missing]).toEqual(["Estuary Works", "2026", 12, []]);
    for (const k of ["co2_t", "ch4_t", "n2o_t", "co2e_t", "transferred_co2_t", "net_co2e_t", "net_co2_t"])
      expect(close(y.emissions[k], total((m) => m.emissions[k])), k).toBe(true);
    expect(close(y.ammonia_t, total((m) => m.feed.ammonia_t))).toBe(true);
    expect(close(y.transfers_by_destination.urea, total((m) => m.transfers.by_destination.urea.co2_t))).toBe(true);
    const intensity = total((m) => m.emissions.co2e_t).div(total((m) => m.feed.ammonia_t));
    expect(close(y.intensity.co2e_t_per_t_nh3, intensity)).toBe(true);
    // GUM: a sum of months with independent meters cannot be less certain than its largest month
    // nor exceed the linear sum of the monthly uncertainties (common practice, no source)
    const u = new D(y.uncertainty.co2.u95_t);
    expect(u.gt(DecimalBase.max(...monthly.map((m) => m.uncertainty.co2.u95_t)))).toBe(true);
    expect(u.lt(total((m) => m.uncertainty.co2.u95_t))).toBe(true);
  }, 60_000);

  it("the text report shows the year row, units and the split uncertainty", () => {
    const r = runCli(["--year", ...files.slice(0, 3)]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^Synledger year — Estuary Works, 2026 \(3 of 12 months\)/);
    expect(r.stdout).toMatch(/^year\s+\d/m);
    expect(r.stdout).toMatch(/t CO2e\/t NH3/);
    expect(r.stdout).toMatch(/Annual gross CO2: [\d.]+ t ± [\d.]+ t .*95 %.*meters [\d.]+ t, factors [\d.]+ t/);
    expect(r.stdout).toContain("missing April (2026-04)");
  });

  it("files of two sites or two years: exit 2, nothing on stdout, the offending file named", () => {
    const other = writeTemp("other", { "dunmoor.json": plantMonthJson(demoPlantMonths("dunmoor")[1]) })[0];
    const mixed = runCli(["--year", files[0], other]);
    expect([mixed.code, mixed.stdout]).toEqual([2, ""]);
    expect(mixed.stderr).toContain(other);
    expect(mixed.stderr).toMatch(/site: site "Dunmoor Works" differs from "Estuary Works"/);
    const shifted = writeTemp("shift", { "x.json": plantMonthJson({ ...docs[3], month: "2025-04" }) })[0];
    const years = runCli(["--year", files[0], shifted]);
    expect([years.code, years.stdout]).toEqual([2, ""]);
    expect(years.stderr).toMatch(new RegExp(`${shifted}[^]*month: 2025-04 is not in 2026`));
  });
});
