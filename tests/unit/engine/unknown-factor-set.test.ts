// A plant-month naming a factor set the engine does not know is bad input like any other field:
// exit code 2, nothing on stdout, the file and the JSON path `method.factor_set` on stderr
// (shared/product/plant-month-format.md: "Invalid input: exit code 2 and a message naming the
// JSON path and the reason, on stderr; nothing on stdout").
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { runCli } from "../../../lib/balance/cli";
import { runCliProcess, writeTemp } from "./helpers";

const good = readFileSync("examples/estuary-2026-03.json", "utf8");
const doc = JSON.parse(good);
const unknown = JSON.stringify({ ...doc, method: { ...doc.method, factor_set: "ipcc-2019-refinement" } });

describe("unknown factor set", () => {
  it("month, as users run it: exit 2, nothing on stdout, method.factor_set and the known sets on stderr", async () => {
    const [file] = writeTemp("factor-set", { "estuary-unknown-set.json": unknown });
    for (const extra of [[], ["--json"]]) {
      const r = await runCliProcess([file, ...extra]);
      expect([r.code, r.stdout]).toEqual([2, ""]);
      expect(r.stderr).toContain(file);
      expect(r.stderr).toMatch(/^method\.factor_set: unknown factor set "ipcc-2019-refinement" \(known: ipcc-2006, us-40cfr98, eu-mrr\)$/m);
    }
  }, 30_000);
  it("year: the one bad month stops the roll-up and is named; no partial total is printed", () => {
    const texts: Record<string, string> = { "a.json": good, "b.json": unknown };
    const r = runCli(["--year", "a.json", "b.json", "--json"], (f) => texts[f]);
    expect([r.code, r.stdout]).toEqual([2, ""]);
    expect(r.stderr).toMatch(/^b\.json: invalid plant-month document\nmethod\.factor_set: unknown factor set/);
  });
  it("an empty factor set name is refused by the schema at the same path", () => {
    const r = runCli(["x.json"], () => JSON.stringify({ ...doc, method: { ...doc.method, factor_set: "" } }));
    expect([r.code, r.stdout]).toEqual([2, ""]);
    expect(r.stderr).toMatch(/method\.factor_set: must not be empty/);
  });
});
