// The CLI run as a separate process through tsx, as users run it.
import { execFile } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { USAGE, parseArgs, runCli } from "../../../lib/balance/cli";
import { stoichText, variant } from "./fixtures";

const dir = mkdtempSync(join(tmpdir(), "synledger-cli-"));
const run = (text: string, args: string[] = []) =>
  new Promise<{ code: number; stdout: string; stderr: string }>((resolve) => {
    const file = join(dir, `doc-${Math.random().toString(36).slice(2)}.json`);
    writeFileSync(file, text);
    execFile("node_modules/.bin/tsx", ["lib/balance/cli.ts", file, ...args], (err, stdout, stderr) =>
      resolve({ code: err ? ((err as { code?: number }).code ?? 1) : 0, stdout, stderr }),
    );
  });

const bad: [string, string, string, RegExp][] = [
  ["bad JSON", '{"format": "synledger.plant-month/1", }', "(document)", /position/],
  ["unknown unit", JSON.stringify(variant((d) => (d.streams[2].unit = "Xm3"))), "streams[2].unit", /unknown unit/],
  ["negative quantity", JSON.stringify(variant((d) => (d.streams[3].quantity = "-1"))), "streams[3].quantity", /negative/],
  ["non-numeric quantity", JSON.stringify(variant((d) => (d.streams[3].quantity = "lots"))), "streams[3].quantity", /not a number/],
  ["composition sum out of tolerance", JSON.stringify(variant((d) => (d.analyses.methane.components.CH4 = "98"))), "analyses.methane.components", /more than 0.5/],
  ["analysis not defined", JSON.stringify(variant((d) => (d.streams[1].analysis = "nope"))), "streams[1].analysis", /not defined/],
  ["feed-gas without analysis", JSON.stringify(variant((d) => delete d.streams[0].analysis)), "streams[0].analysis", /needs an analysis/],
  ["purge-gas without analysis", JSON.stringify(variant((d) => d.streams.push({ id: "p", kind: "purge-gas", fate: "fuel", quantity: "1", unit: "t" }))), "streams[6].analysis", /needs an analysis/],
  ["purge-gas without fate", JSON.stringify(variant((d) => d.streams.push({ id: "p", kind: "purge-gas", analysis: "methane", quantity: "1", unit: "t" }))), "streams[6].fate", /needs a fate/],
  ["co2-export without destination", JSON.stringify(variant((d) => delete d.streams[4].destination)), "streams[4].destination", /destination/],
  ["MWh on a gas stream", JSON.stringify(variant((d) => (d.streams[1].unit = "MWh"))), "streams[1].unit", /not valid/],
  ["duplicate stream id", JSON.stringify(variant((d) => (d.streams[1].id = "feed"))), "streams[1].id", /duplicate/],
  ["bad month", JSON.stringify(variant((d) => (d.month = "26-03"))), "month", /YYYY-MM/],
  ["GJ-LHV on a non-combustible analysis", JSON.stringify(variant((d) => { d.analyses.methane.components = { N2: "100" }; d.streams[0].unit = "GJ-LHV"; })), "streams[0].unit", /combustible/],
];

describe("CLI: invalid input → exit 2, nothing on stdout, path and reason on stderr", () => {
  it.each(bad)("%s", async (_name, text, path, reason) => {
    const r = await run(text);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe("");
    expect(r.stderr).toContain(`${path}: `);
    expect(r.stderr).toMatch(reason);
  }, 20_000);
});

describe("CLI: valid input", () => {
  it("--json prints the result document with the format's stable keys", async () => {
    const r = await run(stoichText(), ["--json"]);
    expect(r.code).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc.format).toBe("synledger.result/1");
    expect(Object.keys(doc)).toEqual(expect.arrayContaining(["streams", "balances", "synthesis", "emissions", "intensity", "flags", "reconciliation"]));
    // hand-built plant: closes exactly and H2:N2 = 3 (fixtures.ts)
    expect(doc.balances.carbon.closure_pct).toBe("0");
    expect(doc.synthesis.h2_n2_ratio).toBe("3");
  }, 20_000);
  it("the readable report has units in its headers", async () => {
    const r = await run(stoichText());
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/GJ LHV\/t NH3/);
    expect(r.stdout).toMatch(/closure %/);
  }, 20_000);
});

describe("argument parser and runCli", () => {
  it("parses options and rejects unknown ones", () => {
    expect(parseArgs(["a.json", "--json", "--tolerance", "2.5"]).tolerancePct?.toFixed()).toBe("2.5");
    expect(() => parseArgs(["--month", "a.json"])).toThrow(/unknown option/);
    expect(() => parseArgs([])).toThrow(/exactly one/);
    expect(() => parseArgs(["a.json", "b.json"])).toThrow(/exactly one/);
    expect(parseArgs(["--year", "a.json", "b.json", "--json"])).toMatchObject({ mode: "year", files: ["a.json", "b.json"], json: true });
    expect(() => parseArgs(["--year"])).toThrow(/--year needs/);
  });
  it("runCli reports usage and unreadable files with exit 2", () => {
    expect(runCli([]).stderr).toContain(USAGE);
    const r = runCli(["missing.json"], () => {
      throw new Error("ENOENT");
    });
    expect([r.code, r.stdout]).toEqual([2, ""]);
  });
  it("--no-reconcile drops the reconciliation block", () => {
    const r = runCli(["x.json", "--json", "--no-reconcile"], () => stoichText());
    expect(JSON.parse(r.stdout).reconciliation).toBeNull();
  });
});
