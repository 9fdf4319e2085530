import { describe, expect, it } from "vitest";
import { decodeCsv, parseCsv } from "@/lib/import/csv";
import { importMappingSchema, type ImportMappingInput } from "@/lib/import/mapping";
import { validateTable } from "@/lib/import/validate";
import { SITE } from "./site";

const LONG: ImportMappingInput = {
  name: "Daily totals",
  layout: "long",
  delimiter: ",",
  dateColumn: "Date",
  dateFormat: "DD/MM/YYYY",
  streamColumn: "Tag",
  quantityColumn: "Total",
  unitColumn: "Unit",
};

function run(text: string, mapping: ImportMappingInput = LONG) {
  const m = importMappingSchema.parse(mapping);
  const bytes = new TextEncoder().encode(text);
  return validateTable(parseCsv(decodeCsv(bytes), m.delimiter), m, SITE);
}

const BAD = [
  "\uFEFFDate,Tag,Total,Unit",
  "01/03/2026,TW-FQ-101,850000.5,Sm3",
  "01/03/2026,nh3,1450.2,t",
  '02/03/2026,TW-FQ-101,"851,000",Sm3',
  "31/02/2026,nh3,1449,t",
  "02/03/2026,nh3,about 1400,t",
  "03/03/2026,TW-FQ-101,-5,Sm3",
  "03/03/2026,TW-FQ-999,12,Sm3",
  "01/03/2026,nh3,1450.2,t",
  "04/03/2026,nh3,12,Sm3",
  "",
  "05/03/2026,nh3,1451",
  "05/03/2026,TW-OLD,3,t",
].join("\r\n");

describe("a file with good and bad rows", () => {
  it("names every bad row and cell: row as in the file, column by header, reason", () => {
    const r = run(BAD);
    expect(r.issues).toEqual([
      { row: 4, column: "Total", reason: '"851,000" contains a comma (","), which the mapping does not declare; set it as the thousands separator in the column mapping, or remove it' },
      { row: 5, column: "Date", reason: '"31/02/2026": 2026-02 has no day 31 (read as DD/MM/YYYY)' },
      { row: 6, column: "Total", reason: '"about 1400" is not a number' },
      { row: 7, column: "Total", reason: '"-5" is negative; a quantity cannot be below zero' },
      { row: 8, column: "Tag", reason: 'no stream or meter tag "TW-FQ-999" at Test Works' },
      { row: 9, column: "Date", reason: '"nh3" for 2026-03-01 is already in row 3' },
      { row: 10, column: "Unit", reason: 'Sm3 is not a unit for the ammonia stream "nh3" (use t, kg)' },
      { row: 12, column: null, reason: "has 3 fields; the header has 4 (check the delimiter and the quoting)" },
      { row: 13, column: "Tag", reason: 'stream "old" is archived' },
    ]);
    expect(r.rowCount).toBe(11); // the blank line is not a data row, but rows keep their file numbers
  });

  it("the corrected file sums into the month", () => {
    const fixed = [
      "Date,Tag,Total,Unit",
      "01/03/2026,TW-FQ-101,850000.5,Sm3",
      "01/03/2026,nh3,1450.2,t",
      '02/03/2026,TW-FQ-101,"851000",Sm3',
      "02/03/2026,nh3,1449,t",
      "03/03/2026,feed,0.25,",
    ].join("\n");
    const r = run(fixed);
    expect(r.issues).toEqual([]);
    expect(r.months).toEqual([
      {
        month: "2026-03",
        readings: [
          { stream: "feed", quantity: "1701000.75", unit: "Sm3", values: 3, firstRow: 2 },
          { stream: "nh3", quantity: "2899.2", unit: "t", values: 2, firstRow: 3 },
        ],
        analyses: [],
        // The last day with a value: what the month's figures cover.
        lastDay: "2026-03-03",
      },
    ]);
    expect(r.warnings.map((w) => w.message)).toEqual([
      "3 of 31 days in the file: the month's total covers only those days",
      "2 of 31 days in the file: the month's total covers only those days",
    ]);
  });

  it("reads declared thousands separators", () => {
    const r = run('Date,Tag,Total,Unit\n01/03/2026,feed,"1,250,000.5",Sm3\n', { ...LONG, thousandsSeparator: "," });
    expect(r.issues).toEqual([]);
    expect(r.months[0].readings[0].quantity).toBe("1250000.5");
  });

  it("says when the file uses another delimiter than the mapping", () => {
    const r = run("Date;Tag;Total;Unit\n01/03/2026;feed;1;Sm3\n");
    expect(r.issues).toEqual([
      { row: 1, column: null, reason: 'the header is one single column "Date;Tag;Total;Unit": the file looks semicolon-separated, but the mapping says comma' },
    ]);
    expect(run("Date;Tag;Total;Unit\n01/03/2026;feed;1;Sm3\n", { ...LONG, delimiter: "auto" }).issues).toEqual([]);
  });

  it("names a mapped column the file lacks, once, instead of failing every row", () => {
    const r = run("Day,Tag,Total\n01/03/2026,feed,1\n", { ...LONG, unitColumn: undefined });
    expect(r.issues).toEqual([{ row: 1, column: "Date", reason: 'no column "Date" in the file (its columns: "Day", "Tag", "Total")' }]);
  });

  it("refuses mixed units for one stream in one month", () => {
    const r = run("Date,Tag,Total,Unit\n01/03/2026,feed,1,Sm3\n02/03/2026,feed,1,kSm3\n");
    expect(r.issues).toEqual([{ row: 3, column: "Unit", reason: 'kSm3 differs from Sm3 used for "feed" in 2026-03 (row 2); use one unit per stream and month' }]);
  });
});

describe("sums are exact decimals", () => {
  it("31 days of 0.1 make exactly 3.1, and months are kept apart", () => {
    const lines = ["Date,feed"];
    for (let d = 1; d <= 31; d++) lines.push(`2026-03-${String(d).padStart(2, "0")},0.1`);
    lines.push("2026-04-01,0.2");
    const r = run(lines.join("\n"), { name: "Wide", layout: "wide", dateColumn: "Date", dateFormat: "YYYY-MM-DD", columns: [{ column: "feed", stream: "feed" }] });
    expect(r.issues).toEqual([]);
    expect(r.months.map((m) => [m.month, m.readings[0].quantity, m.readings[0].values])).toEqual([
      ["2026-03", "3.1", 31],
      ["2026-04", "0.2", 1],
    ]);
    expect(r.warnings).toEqual([{ month: "2026-04", subject: "feed", message: "1 of 30 days in the file: the month's total covers only those days" }]);
  });

  it("keeps digits a float would lose", () => {
    const r = run("Date,feed\n2026-03-01,9007199254740993.1\n2026-03-02,0.0000000000000000001\n", {
      name: "Wide", layout: "wide", dateColumn: "Date", dateFormat: "YYYY-MM-DD", columns: [{ column: "feed", stream: "feed" }],
    });
    expect(r.months[0].readings[0].quantity).toBe("9007199254740993.1000000000000000001");
  });
});

describe("wide and analysis layouts", () => {
  it("wide: a day twice, text in a cell, empty cells skipped, decimal comma", () => {
    const text = "Datum;feed;NH3 t\n01.03.2026;850000,5;1450,2\n01.03.2026;1;\n02.03.2026;;1449\n03.03.2026;x;1\n";
    const r = run(text, {
      name: "Wide", layout: "wide", delimiter: ";", dateColumn: "Datum", dateFormat: "DD.MM.YYYY", decimalSeparator: ",",
      columns: [{ column: "feed", stream: "feed" }, { column: "NH3 t", stream: "TW-WQ-501" }],
    });
    expect(r.issues).toEqual([
      { row: 3, column: "Datum", reason: '"feed" for 2026-03-01 is already in row 2' },
      { row: 5, column: "feed", reason: '"x" is not a number' },
    ]);
    expect(r.months[0].readings).toEqual([
      { stream: "feed", quantity: "850000.5", unit: "Sm3", values: 1, firstRow: 2 },
      { stream: "nh3", quantity: "2900.2", unit: "t", values: 3, firstRow: 2 },
    ]);
  });

  it("analyses: components per column, sum checked, one sample per month", () => {
    const text = [
      "Sampled,Gas,CH4,C2H6,N2,CO2",
      "2026-03-10,grid-gas,95.2,2.8,1.0,1.0",
      "2026-03-20,grid-gas,95.0,3.0,1.0,1.0",
      "2026-04-10,feed,90,2,1,1",
      "2026-04-11,nh3,95,3,1,1",
    ].join("\n");
    const r = run(text, {
      name: "Lab", layout: "analyses", dateColumn: "Sampled", dateFormat: "YYYY-MM-DD", analysisColumn: "Gas",
      components: [{ column: "CH4", component: "CH4" }, { column: "C2H6", component: "C2H6" }, { column: "N2", component: "N2" }, { column: "CO2", component: "CO2" }],
    });
    expect(r.issues).toEqual([
      { row: 3, column: "Gas", reason: 'a second sample of "grid-gas" for 2026-03 (the first is in row 2); import one analysis per month' },
      { row: 4, column: null, reason: "the components sum to 94 mol %, more than 0.5 from 100" },
      { row: 5, column: "Gas", reason: 'no analysis or gas stream "nh3" at Test Works (analyses: grid-gas)' },
    ]);
    expect(r.months[0].analyses).toEqual([{ key: "grid-gas", components: { CH4: "95.2", C2H6: "2.8", N2: "1", CO2: "1" }, sampledOn: "2026-03-10", row: 2 }]);
  });
});

describe("file encoding", () => {
  it("strips a UTF-8 byte-order mark and refuses UTF-16 and binary", () => {
    expect(decodeCsv(new Uint8Array([0xef, 0xbb, 0xbf, 0x41]))).toBe("A");
    expect(() => decodeCsv(new Uint8Array([0xff, 0xfe, 0x41, 0x00]))).toThrow(/UTF-16/);
    expect(() => decodeCsv(new Uint8Array([0x41, 0x00, 0x42]))).toThrow(/NUL/);
    expect(() => decodeCsv(new Uint8Array([0x41, 0xe9, 0x42]))).toThrow(/not UTF-8/);
  });
});
