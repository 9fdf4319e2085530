/**
 * The shared readers' refusals: duplicate keys and lone surrogates in JSON (RFC 8259 section 4
 * says names "SHOULD be unique"; RFC 7493, I-JSON, section 2.1 forbids unpaired surrogates), the
 * plant-month size bound for the CLI, and the CSV writer's neutralised cells and comment lines.
 */
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { runCli } from "@/lib/balance/cli";
import { readJson, JsonSyntaxError } from "@/lib/balance/json-reader";
import { LIMITS, utf8Length } from "@/lib/balance/limits";
import { parsePlantMonthText } from "@/lib/balance/schema";
import { csvCell, csvDocument } from "@/lib/csv";

describe("JSON reader", () => {
  it("refuses a duplicate key, pointing at the second one", () => {
    let caught: unknown = null;
    try {
      readJson('{"a": 1, "a": 2}');
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(JsonSyntaxError);
    expect((caught as JsonSyntaxError).reason).toBe('duplicate property name "a"');
    expect((caught as JsonSyntaxError).column).toBe(10);
  });

  it("refuses a lone surrogate but keeps a pair", () => {
    expect(() => readJson('"x\\ud800y"')).toThrow(/lone UTF-16 surrogate/);
    expect(() => readJson('"\\udc00"')).toThrow(/lone UTF-16 surrogate/);
    expect(readJson('"\\ud83d\\ude00"')).toBe("😀");
  });
});

describe("plant-month size bound", () => {
  it("counts UTF-8 bytes as Buffer does", () => {
    for (const s of ["abc", "é€", "😀x", "\ud800", "Ω".repeat(1000)]) expect(utf8Length(s)).toBe(Buffer.byteLength(s, "utf8"));
  });

  it("a document over 1 MiB is refused before it is parsed", () => {
    const r = parsePlantMonthText(`{"note": "${"x".repeat(LIMITS.fileBytes)}"}`);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0].reason).toMatch(/more than the 1048576 bytes/);
  });

  // Regression (issue 11): the CLI read a 40 MB file for 7.6 s.
  it("the CLI refuses a file over the bound from its size, without reading it (exit 2)", () => {
    const dir = mkdtempSync(join(tmpdir(), "synledger-cli-"));
    const file = join(dir, "huge.json");
    writeFileSync(file, Buffer.alloc(LIMITS.fileBytes + 1, 0x20));
    const out = runCli([file]);
    expect(out.code).toBe(2);
    expect(out.stdout).toBe("");
    expect(out.stderr).toMatch(/huge\.json: cannot read file \(the document is 1048577 bytes, more than the 1048576 bytes/);
  });
});

describe("CSV writer", () => {
  it("neutralises text a spreadsheet would run, leaves numbers alone", () => {
    expect(csvCell("=1+1")).toBe("'=1+1");
    expect(csvCell("@SUM(A1)")).toBe("'@SUM(A1)");
    expect(csvCell("-2+3")).toBe("'-2+3");
    expect(csvCell("-12.5")).toBe("-12.5");
    expect(csvCell('say "hi", then')).toBe('"say ""hi"", then"');
  });

  it("writes a comment line as one cell, so a comma in it opens no formula cell", () => {
    const text = csvDocument(['site X,=HYPERLINK("http://evil.example/x")'], ["a"], [["1"]]);
    const rows = Papa.parse<string[]>(text.trim()).data;
    expect(rows[0]).toEqual(['# site X,=HYPERLINK("http://evil.example/x")']);
    expect(rows.slice(1)).toEqual([["a"], ["1"]]);
  });
});
