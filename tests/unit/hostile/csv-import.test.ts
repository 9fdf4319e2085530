/**
 * Hostile input for the CSV import's parse and validate steps (lib/import): random bytes, random
 * delimiters, random quoting, huge fields. The documented outcomes are a CsvFileError from
 * decoding (with a sentence saying what to do) or a table whose every problem names a row and a
 * reason; nothing else may escape, and nothing may hang.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CsvFileError, decodeCsv, parseCsv } from "@/lib/import/csv";
import { DELIMITERS, importMappingSchema, type ImportMappingInput } from "@/lib/import/mapping";
import type { ValidationResult } from "@/lib/import/types";
import { validateTable } from "@/lib/import/validate";
import { SITE } from "../import/site";

const RUNS = { numRuns: 200 };

const LONG: ImportMappingInput = { name: "fuzz", layout: "long", delimiter: ",", dateColumn: "Date", dateFormat: "YYYY-MM-DD", streamColumn: "Tag", quantityColumn: "Total", unitColumn: "Unit" };
const WIDE: ImportMappingInput = { name: "fuzz", layout: "wide", delimiter: ",", dateColumn: "Date", dateFormat: "DD/MM/YYYY", columns: [{ column: "feed", stream: "feed" }, { column: "nh3", stream: "nh3" }] };
const ANALYSES: ImportMappingInput = { name: "fuzz", layout: "analyses", delimiter: ",", dateColumn: "Date", dateFormat: "YYYY-MM-DD", analysisColumn: "Gas", components: [{ column: "CH4", component: "CH4" }, { column: "N2", component: "N2" }] };

function expectDocumented(run: () => ValidationResult | null): void {
  let result: ValidationResult | null;
  try {
    result = run();
  } catch (err) {
    // The one error the reading step may raise: a file that is not UTF-8 CSV text, said plainly.
    expect(err).toBeInstanceOf(CsvFileError);
    expect((err as Error).message).toMatch(/save it as|not a text|UTF-16/);
    return;
  }
  if (!result) return;
  for (const i of result.issues) {
    expect(Number.isInteger(i.row) && i.row >= 1).toBe(true);
    expect(i.reason.trim().length).toBeGreaterThan(0);
  }
  for (const m of result.months) for (const r of m.readings) expect(r.quantity).toMatch(/^\d+(\.\d+)?$/);
}

function pipeline(bytes: Uint8Array, mapping: ImportMappingInput, delimiter: (typeof DELIMITERS)[number]): ValidationResult {
  const m = importMappingSchema.parse({ ...mapping, delimiter });
  return validateTable(parseCsv(decodeCsv(bytes), m.delimiter, 10_000), m, SITE);
}

const delimiter = fc.constantFrom(...DELIMITERS);
const mapping = fc.constantFrom(LONG, WIDE, ANALYSES);
/** Cells that stress quoting, separators, numbers and dates. */
const cell = fc.oneof(
  fc.string({ maxLength: 20 }),
  fc.constantFrom("", '"', '""', '"a,b"', "a\nb", "\r", ";", "\t", "|", "1,234.5", "(12)", "-0", "1e9", "2026-02-30", "31/12/2026", "TW-FQ-101", "nh3", "feed", "Sm3", "t", "\u0000", "\uFEFF", "'; DROP TABLE readings; --", "<script>alert(1)</script>"),
  fc.double().map(String),
);
const table = fc.tuple(fc.array(cell, { minLength: 1, maxLength: 6 }), fc.array(fc.array(cell, { maxLength: 7 }), { maxLength: 30 }), fc.constantFrom(",", ";", "\t", "|"), fc.constantFrom("\n", "\r\n", "\r"));

describe("CSV import under hostile input", () => {
  it("random bytes, any mapping, any delimiter: a CsvFileError or a table of named problems", () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 600 }), mapping, delimiter, (bytes, m, d) => expectDocumented(() => pipeline(bytes, m, d))),
      RUNS,
    );
  });

  it("random text shaped like CSV (quotes, line ends, separators): every problem has a row and a reason", () => {
    fc.assert(
      fc.property(table, mapping, delimiter, ([head, rows, sep, eol], m, d) => {
        const text = [head, ...rows].map((r) => r.join(sep)).join(eol);
        expectDocumented(() => pipeline(new TextEncoder().encode(text), m, d));
      }),
      RUNS,
    );
  });

  it("a valid header over random rows: rows are checked one by one and every bad one is named", () => {
    fc.assert(
      fc.property(fc.array(fc.array(cell, { minLength: 4, maxLength: 4 }), { minLength: 1, maxLength: 40 }), (rows) => {
        const text = ["Date,Tag,Total,Unit", ...rows.map((r) => r.map((c) => `"${c.replace(/"/g, '""')}"`).join(","))].join("\n");
        let r: ValidationResult | null = null;
        expectDocumented(() => (r = pipeline(new TextEncoder().encode(text), LONG, ",")));
        if (!r) return;
        const result: ValidationResult = r;
        // A row that was neither summed nor named would be a value silently dropped.
        const named = new Set(result.issues.map((i) => i.row));
        expect(result.valueCount + named.size).toBeGreaterThanOrEqual(result.rowCount);
      }),
      RUNS,
    );
  });

  it("a 4 MiB field and a 200 000-column line: no crash, a clear problem, in one pass", () => {
    const huge = "9".repeat(4 * 1024 * 1024);
    const r1 = pipeline(new TextEncoder().encode(`Date,Tag,Total,Unit\n2026-03-01,nh3,${huge},t\n`), LONG, ",");
    expect(r1.issues.length + r1.valueCount).toBeGreaterThan(0);
    const r2 = pipeline(new TextEncoder().encode(`Date,Tag,Total,Unit\n2026-03-01,nh3,"${"x".repeat(1_000_000)}",t\n`), LONG, ",");
    expect(r2.issues).toEqual([expect.objectContaining({ row: 2, column: "Total", reason: expect.stringMatching(/not a number/) })]);
    const wide = `${Array.from({ length: 200_000 }, (_, i) => `c${i}`).join(",")}\n1\n`;
    const r3 = pipeline(new TextEncoder().encode(wide), LONG, ",");
    expect(r3.issues[0]).toMatchObject({ row: 1, reason: expect.stringMatching(/no column "Date"/) });
  });

  it("an unclosed quote swallowing the rest of the file is reported, not hung on", () => {
    const r = pipeline(new TextEncoder().encode('Date,Tag,Total,Unit\n2026-03-01,nh3,"12,t\n2026-03-02,nh3,13,t\n'), LONG, ",");
    expect(r.issues.length).toBeGreaterThan(0);
    expect(r.valueCount).toBe(0);
  });

  it("NUL bytes, UTF-16 and Latin-1 are refused with what to do instead", () => {
    const cases: [number[], RegExp][] = [
      [[0x44, 0x00, 0x61], /NUL bytes/],
      [[0xff, 0xfe, 0x44, 0x00], /UTF-16/],
      [[0x44, 0x61, 0x74, 0x65, 0x0a, 0xe9], /not UTF-8/],
    ];
    for (const [bytes, message] of cases) expect(() => decodeCsv(Uint8Array.from(bytes))).toThrow(message);
  });
});
