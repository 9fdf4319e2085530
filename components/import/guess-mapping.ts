import { COMPONENTS } from "@/lib/balance/components";
import { DATE_FORMATS, type DateFormat } from "@/lib/import/dates";
import type { ImportMappingInput } from "@/lib/import/mapping";
import type { FileSample, SavedMapping, WizardStream } from "./types";

const find = (headers: string[], re: RegExp) => headers.find((h) => re.test(h));

/** The date format the first sample value fits; DD/MM before MM/DD, which the engineer must confirm. */
export function guessDateFormat(value: string | undefined): DateFormat {
  const v = (value ?? "").trim();
  const tests: [DateFormat, RegExp][] = [
    ["YYYY-MM-DD", /^\d{4}-\d{2}-\d{2}/],
    ["YYYY-MM", /^\d{4}-\d{2}$/],
    ["DD.MM.YYYY", /^\d{1,2}\.\d{1,2}\.\d{4}$/],
    ["MM/DD/YYYY", /^\d{1,2}\/(1[3-9]|2\d|3[01])\/\d{4}$/],
    ["DD/MM/YYYY", /^\d{1,2}\/\d{1,2}\/\d{4}$/],
    ["MM/YYYY", /^\d{1,2}\/\d{4}$/],
  ];
  return tests.find(([, re]) => re.test(v))?.[0] ?? DATE_FORMATS[0];
}

export function streamFor(header: string, streams: WizardStream[]): WizardStream | undefined {
  const h = header.trim().toLowerCase();
  return streams.find((s) => s.key.toLowerCase() === h || s.meterTag?.toLowerCase() === h || s.name.toLowerCase() === h);
}

/** A saved mapping whose columns all exist in this file, else a first guess from the header names. */
export function proposeMapping(sample: FileSample, streams: WizardStream[], saved: SavedMapping[]): { mapping: ImportMappingInput; from: string | null } {
  const has = (c: string | undefined) => c === undefined || sample.headers.includes(c);
  for (const s of saved) {
    const m = s.mapping;
    const cols = m.layout === "long" ? [m.streamColumn, m.quantityColumn, m.unitColumn] : m.layout === "wide" ? m.columns.map((c) => c.column) : [m.analysisColumn, ...m.components.map((c) => c.column)];
    if ([m.dateColumn, ...cols].every(has)) return { mapping: m, from: s.name };
  }
  const h = sample.headers;
  const dateColumn = find(h, /date|day|datum|time|period|month/i) ?? h[0] ?? "";
  const dateFormat = guessDateFormat(sample.rows[0]?.[h.indexOf(dateColumn)]);
  const base = { delimiter: "auto" as const, dateColumn, dateFormat, decimalSeparator: "." as const, thousandsSeparator: "none" as const };
  const comps = h.filter((x) => (COMPONENTS as readonly string[]).includes(x));
  if (comps.length >= 2) {
    return {
      mapping: { ...base, name: "Lab analyses", layout: "analyses", analysisColumn: find(h, /gas|analysis|sample|stream|point/i) ?? "", components: comps.map((c) => ({ column: c, component: c as (typeof COMPONENTS)[number] })) },
      from: null,
    };
  }
  const wide = h.filter((x) => x !== dateColumn && streamFor(x, streams));
  if (wide.length >= 1 && !find(h, /tag|stream|meter/i)) {
    return { mapping: { ...base, name: "Daily totals per stream", layout: "wide", columns: wide.map((c) => ({ column: c, stream: streamFor(c, streams)!.key })) }, from: null };
  }
  return {
    mapping: {
      ...base,
      name: "Meter totals",
      layout: "long",
      streamColumn: find(h, /tag|stream|meter|point/i) ?? "",
      quantityColumn: find(h, /total|qty|quantity|value|amount|reading/i) ?? "",
      unitColumn: find(h, /^(unit|uom|units)$/i),
    },
    from: null,
  };
}
