import { describe, expect, it } from "vitest";
import { fmt, dec, sum } from "../../../lib/balance/decimal";
import { JsonNumber, JsonSyntaxError, readJson } from "../../../lib/balance/json-reader";
import { describeIssues, formatPath, parsePlantMonth, parsePlantMonthText } from "../../../lib/balance/schema";
import { type LooseDoc, STOICH_PLANT, stoichText, variant } from "./fixtures";

const issuesOf = (doc: unknown) => {
  const r = parsePlantMonth(doc);
  if (r.ok) throw new Error("expected the document to be rejected");
  return r.issues;
};

describe("readJson keeps number literals (no binary floating point)", () => {
  it("a 40-digit number survives digit for digit", () => {
    const v = readJson('{"q": 0.1000000000000000055511151231257827021181583404541015625}') as { q: JsonNumber };
    expect(v.q.text).toBe("0.1000000000000000055511151231257827021181583404541015625");
  });
  it("strings, escapes, arrays, literals", () => {
    expect(readJson('["a\\u0041\\n", true, false, null, -1.5e3]')).toEqual(["aA\n", true, false, null, new JsonNumber("-1.5e3")]);
  });
  it("bad JSON reports line, column and position", () => {
    try {
      readJson('{\n  "a": 1,\n  "b": }');
      throw new Error("no error");
    } catch (e) {
      expect(e).toBeInstanceOf(JsonSyntaxError);
      expect((e as JsonSyntaxError).line).toBe(3);
      expect((e as Error).message).toMatch(/line 3 column 8 \(position 19\)/);
    }
  });
  it("trailing garbage is an error", () => expect(() => readJson("{} x")).toThrow(/after the JSON value/));
});

describe("plant-month schema", () => {
  it("accepts the hand-built plant; numbers as strings and as JSON numbers read to the same Decimal", () => {
    const r = parsePlantMonthText(stoichText().replace('"quantity":"160.43"', '"quantity":160.43'));
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.doc.streams[1].quantity.toFixed()).toBe("160.43");
  });
  it("bad JSON: issue at the document with position", () => {
    const r = parsePlantMonthText('{"format": }');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0].reason).toMatch(/position 11/);
  });
  it.each([
    ["unknown unit", (d: LooseDoc) => (d.streams[2].unit = "Xm3"), "streams[2].unit", /unknown unit "Xm3"/],
    ["negative quantity", (d: LooseDoc) => (d.streams[3].quantity = "-5"), "streams[3].quantity", /must not be negative/],
    ["non-numeric quantity", (d: LooseDoc) => (d.streams[0].quantity = "12,5"), "streams[0].quantity", /not a number/],
    ["composition beyond 0.5 of 100", (d: LooseDoc) => (d.analyses.methane.components.CH4 = "99.4"), "analyses.methane.components", /99.4 %/],
    ["analysis not defined", (d: LooseDoc) => (d.streams[0].analysis = "nope"), "streams[0].analysis", /not defined/],
    ["feed-gas without analysis", (d: LooseDoc) => delete d.streams[0].analysis, "streams[0].analysis", /needs an analysis/],
    ["fuel-gas without analysis", (d: LooseDoc) => delete d.streams[1].analysis, "streams[1].analysis", /needs an analysis/],
    ["purge-gas without fate", (d: LooseDoc) => d.streams.push({ id: "p", kind: "purge-gas", analysis: "methane", quantity: "1", unit: "t" }), "streams[6].fate", /needs a fate/],
    ["co2-export without destination", (d: LooseDoc) => delete d.streams[4].destination, "streams[4].destination", /needs a destination/],
    ["MWh on a gas stream", (d: LooseDoc) => (d.streams[0].unit = "MWh"), "streams[0].unit", /not valid for a feed-gas/],
    ["GJ-LHV on process air", (d: LooseDoc) => (d.streams[2].unit = "GJ-LHV"), "streams[2].unit", /not valid for a process-air/],
    ["duplicate stream id", (d: LooseDoc) => (d.streams[5].id = "feed"), "streams[5].id", /duplicate stream id/],
    ["bad month", (d: LooseDoc) => (d.month = "2026-13"), "month", /YYYY-MM/],
    ["unknown component", (d: LooseDoc) => (d.analyses.methane.components.XY = "1"), "analyses.methane.components", /unknown component XY/],
    ["typo in a stream key", (d: LooseDoc) => (d.streams[0].quantiy = "1"), "streams[0]", /quantiy/],
  ])("rejects %s with a JSON path", (_name, edit, path, reason) => {
    const issues = issuesOf(variant(edit));
    const hit = issues.find((i) => i.path === path);
    expect(hit, describeIssues(issues)).toBeDefined();
    expect(hit!.reason).toMatch(reason);
  });
  it("composition within 0.5 of 100 is accepted (normalised later, with a flag)", () => {
    expect(parsePlantMonth(variant((d) => (d.analyses.methane.components.CH4 = "99.6"))).ok).toBe(true);
  });
});

describe("helpers", () => {
  it("formatPath writes streams[2].quantity and quotes odd keys", () => {
    expect(formatPath(["streams", 2, "quantity"])).toBe("streams[2].quantity");
    expect(formatPath(["analyses", "a b", "components"])).toBe('analyses["a b"].components');
  });
  it("describeIssues joins path and reason", () => {
    expect(describeIssues([{ path: "month", reason: "bad" }, { path: "", reason: "x" }])).toBe("month: bad\n(document): x");
  });
  it("dec refuses floats; sum and fmt are exact", () => {
    expect(() => dec(0.1)).toThrow();
    expect(sum([dec("0.1"), dec("0.2")]).toFixed()).toBe("0.3");
    expect(fmt(dec("1.23456"), 2)).toBe("1.23");
    expect(fmt(null)).toBeNull();
  });
  it("the fixture is a valid document", () => expect(parsePlantMonth(STOICH_PLANT).ok).toBe(true));
});
