// Golden figures: every number the engine publishes (the result document, 15 significant
// digits) for the demo months of both sites, two of the benchmark's variants and the example
// files, plus each demo year's roll-up, compared with the files in ./golden. They were written
// before the engine was made faster (issue 16) and must not move by a digit when only speed
// changes; a change of method updates them deliberately (`npx vitest run -u` on this file) and
// the commit says which figures moved and why.
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { calculate } from "../../../lib/balance/calculate";
import { toResultDocument } from "../../../lib/balance/result";
import { parsePlantMonthText, type PlantMonth } from "../../../lib/balance/schema";
import { rollUp, toYearDocument } from "../../../lib/balance/year";
import { demoPlantMonths } from "../../../lib/demo/scenario";

/** The document without the engine's version string, which names the build, not a figure. */
function figures(doc: PlantMonth) {
  const { engine: _engine, ...rest } = toResultDocument(calculate(doc));
  return rest;
}

const text = (value: unknown) => JSON.stringify(value, null, 1) + "\n";

const demo: [string, PlantMonth[]][] = [
  ["estuary", demoPlantMonths("estuary")],
  ["dunmoor", demoPlantMonths("dunmoor")],
  ["estuary-bench-0", demoPlantMonths("estuary", "bench-0")],
  ["dunmoor-bench-1", demoPlantMonths("dunmoor", "bench-1")],
];

describe.each(demo)("golden figures of the %s months", (name, months) => {
  it("every month's result document is unchanged", async () => {
    await expect(text(months.map(figures))).toMatchFileSnapshot(join("golden", `${name}.json`));
  });
  it("the year's roll-up is unchanged", async () => {
    const y = toYearDocument(rollUp(months.map((doc) => ({ file: doc.month, doc, result: calculate(doc) }))));
    await expect(text(y)).toMatchFileSnapshot(join("golden", `${name}-year.json`));
  });
});

const examples = readdirSync("examples").filter((f) => f.endsWith(".json") && !f.startsWith("bad-"));

describe.each(examples)("golden figures of examples/%s", (file) => {
  it("the result document is unchanged", async () => {
    const parsed = parsePlantMonthText(readFileSync(join("examples", file), "utf8"));
    if (!parsed.ok) throw new Error(`examples/${file} no longer parses`);
    await expect(text(figures(parsed.doc))).toMatchFileSnapshot(join("golden", `example-${file}`));
  });
});
