/**
 * Hostile input for the plant-month parser (lib/balance/schema.ts + json-reader.ts): arbitrary
 * text, arbitrary JSON and mutated copies of a valid document. Whatever comes in, the parser
 * answers with its documented result ({ok:true, doc} or {ok:false, issues}), never a throw, and
 * every issue says where (a JSON path, "" for the document itself) and what.
 */
import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { MAX_JSON_DEPTH } from "@/lib/balance/json-reader";
import { parsePlantMonth, parsePlantMonthText, type ParseResult } from "@/lib/balance/schema";

const VALID_TEXT = readFileSync("examples/estuary-2026-03.json", "utf8");
const VALID = JSON.parse(VALID_TEXT) as Record<string, unknown>;
const TOP_KEYS = Object.keys(VALID);
const RUNS = { numRuns: 200 };

/** streams[2].quantity, analyses.estuary-grid-gas.components, analyses["a b"], or "" (the document). */
const JSON_PATH = /^(|[A-Za-z0-9_-]+|\["(?:[^"\\]|\\.)*"\])((\.[A-Za-z0-9_-]+)|(\[\d+\])|(\["(?:[^"\\]|\\.)*"\]))*$/;

/** The documented shape of a refusal; throws (failing the property) when it is anything else. */
function expectWellFormed(r: ParseResult): void {
  if (r.ok) return;
  expect(r.issues.length).toBeGreaterThan(0);
  for (const issue of r.issues) {
    expect(typeof issue.path).toBe("string");
    expect(issue.path).toMatch(JSON_PATH);
    expect(typeof issue.reason).toBe("string");
    expect(issue.reason.trim().length).toBeGreaterThan(0);
  }
}

/** A random location inside the valid document, as a list of keys and indices. */
function pathsOf(value: unknown, prefix: (string | number)[] = []): (string | number)[][] {
  if (Array.isArray(value)) return value.flatMap((v, i) => [[...prefix, i], ...pathsOf(v, [...prefix, i])]);
  if (value && typeof value === "object") return Object.entries(value).flatMap(([k, v]) => [[...prefix, k], ...pathsOf(v, [...prefix, k])]);
  return [];
}
const ALL_PATHS = pathsOf(VALID);

type Mutation = { kind: "replace"; path: (string | number)[]; value: unknown } | { kind: "delete"; path: (string | number)[] } | { kind: "add"; path: (string | number)[]; key: string; value: unknown };

function apply(doc: unknown, m: Mutation): unknown {
  const copy = structuredClone(doc) as Record<string | number, unknown>;
  let parent = copy as Record<string | number, unknown>;
  for (const k of m.path.slice(0, -1)) {
    const next = parent[k];
    // An earlier mutation removed or replaced this branch: the mutation has nothing to act on.
    if (!next || typeof next !== "object") return copy;
    parent = next as Record<string | number, unknown>;
  }
  const last = m.path[m.path.length - 1];
  if (m.kind === "replace") parent[last] = m.value;
  else if (m.kind === "delete") {
    if (Array.isArray(parent)) parent.splice(Number(last), 1);
    else delete parent[last];
  } else {
    const target = parent[last];
    if (target && typeof target === "object" && !Array.isArray(target)) (target as Record<string, unknown>)[m.key] = m.value;
    else parent[last] = { [m.key]: m.value };
  }
  return copy;
}

/** Values a careless or hostile sender puts where a field belongs. */
const nasty = fc.oneof(
  fc.jsonValue(),
  fc.constantFrom("-1", "1e400", "NaN", "Infinity", "", " ", "1,5", "0x10", "1e-400", "١٢٣", "'; DROP TABLE readings; --", "<script>alert(1)</script>", "\u0000", "\u202e", "💥"),
  fc.constantFrom(null, true, [], {}, -0, 1e308, Number.MAX_SAFE_INTEGER + 2),
);

const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  fc.record({ kind: fc.constant("replace" as const), path: fc.constantFrom(...ALL_PATHS), value: nasty }),
  fc.record({ kind: fc.constant("delete" as const), path: fc.constantFrom(...ALL_PATHS) }),
  fc.record({ kind: fc.constant("add" as const), path: fc.constantFrom(...ALL_PATHS.filter((p) => p.length < 4)), key: fc.string({ maxLength: 12 }), value: nasty }),
);

describe("plant-month parser under hostile input", () => {
  it("the valid example parses (so the mutations start from a good document)", () => {
    expect(parsePlantMonthText(VALID_TEXT).ok).toBe(true);
  });

  it("arbitrary text: never throws, always the documented result", () => {
    fc.assert(fc.property(fc.string({ unit: "binary", maxLength: 400 }), (text) => expectWellFormed(parsePlantMonthText(text))), RUNS);
  });

  it("arbitrary JSON text: never throws; a refusal names paths", () => {
    fc.assert(fc.property(fc.json({ maxDepth: 6 }), (text) => expectWellFormed(parsePlantMonthText(text))), RUNS);
  });

  it("arbitrary JavaScript values (callers that parsed JSON themselves): never throws", () => {
    fc.assert(fc.property(fc.anything({ maxDepth: 4 }), (value) => expectWellFormed(parsePlantMonth(value))), RUNS);
  });

  it("one mutation of a valid document: never throws; a refusal points into the document", () => {
    fc.assert(
      fc.property(mutation, (m) => {
        const r = parsePlantMonthText(JSON.stringify(apply(VALID, m)));
        expectWellFormed(r);
        if (!r.ok && m.kind !== "add") {
          // Something inside was broken, so at least one issue names a place inside, under a real top-level key.
          const inside = r.issues.filter((i) => i.path !== "");
          expect(inside.length).toBeGreaterThan(0);
          for (const i of inside) expect(TOP_KEYS).toContain(i.path.split(/[.[]/)[0]);
        }
      }),
      RUNS,
    );
  });

  it("three mutations at once, and the text truncated anywhere: never throws", () => {
    fc.assert(
      fc.property(fc.array(mutation, { minLength: 3, maxLength: 3 }), fc.nat(), (ms, cut) => {
        const text = JSON.stringify(ms.reduce<unknown>((d, m) => apply(d, m), VALID));
        expectWellFormed(parsePlantMonthText(text));
        expectWellFormed(parsePlantMonthText(text.slice(0, cut % (text.length + 1))));
      }),
      RUNS,
    );
  });

  it("deep nesting is a JSON error, not a stack overflow", () => {
    for (const text of ["[".repeat(200_000), `${'{"a":'.repeat(50_000)}1${"}".repeat(50_000)}`, `${"[".repeat(MAX_JSON_DEPTH + 1)}${"]".repeat(MAX_JSON_DEPTH + 1)}`]) {
      const r = parsePlantMonthText(text);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.issues).toEqual([{ path: "", reason: expect.stringMatching(/nested deeper than/) }]);
    }
  });

  it("a key named __proto__ or constructor stays data and pollutes nothing", () => {
    const r = parsePlantMonthText(VALID_TEXT.replace('"analyses": {', '"analyses": {"__proto__": {"polluted": true}, "constructor": {"components": {}},'));
    expectWellFormed(r);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(r.ok).toBe(false);
  });
});
