import { RecordDec as Dec } from "@/lib/balance/decimal";
import { SUM_TOLERANCE_PCT } from "@/lib/balance/gas-properties";
import { UNITS_BY_KIND } from "@/lib/balance/schema";
import { UNITS, type Unit } from "@/lib/balance/units";
import { wrongDelimiter, type CsvTable } from "./csv";
import { daysInMonth, isMonthFormat, parseDate } from "./dates";
import type { ImportMapping } from "./mapping";
import { parseNumber, type NumberFormat } from "./numbers";
import type { ImportIssue, ImportSite, ImportStream, ImportWarning, MonthAnalysis, MonthPlan, ValidationResult } from "./types";

type Cells = string[];
interface Sum {
  total: InstanceType<typeof Dec>;
  unit: string;
  values: number;
  firstRow: number;
}

/**
 * Checks a file row by row against the mapping and the site's streams, and sums what is good
 * into calendar months. Every problem is collected (row, column, reason) rather than stopping
 * at the first, so one round of corrections fixes the file. Feed rows with `addRow` in order
 * (the server yields between batches to report progress), then call `finish`.
 */
export class ImportValidator {
  readonly issues: ImportIssue[] = [];
  private readonly warnings: ImportWarning[] = [];
  private readonly index = new Map<string, number>();
  private readonly fmt: NumberFormat;
  private readonly sums = new Map<string, Map<string, Sum>>();
  private readonly analyses = new Map<string, Map<string, MonthAnalysis>>();
  private readonly seen = new Map<string, number>();
  private readonly wide: { col: number; name: string; stream: ImportStream; unit: string }[] = [];
  private readonly components: { col: number; name: string; component: string }[] = [];
  private rowCount = 0;
  private valueCount = 0;
  /** False when the header itself is wrong: every row would fail the same way, so rows are not checked. */
  readonly headerOk: boolean;

  constructor(
    private readonly mapping: ImportMapping,
    private readonly site: ImportSite,
    private readonly headers: string[],
  ) {
    this.fmt = { decimal: mapping.decimalSeparator, thousands: mapping.thousandsSeparator };
    headers.forEach((h, i) => {
      if (this.index.has(h)) this.headerIssue(h, `the header has two columns named "${h}"`);
      else this.index.set(h, i);
    });
    const need = (name: string | undefined) => {
      if (name !== undefined && !this.index.has(name)) this.headerIssue(name, `no column "${name}" in the file (its columns: ${headers.map((h) => `"${h}"`).join(", ")})`);
    };
    need(mapping.dateColumn);
    if (mapping.layout === "long") [mapping.streamColumn, mapping.quantityColumn, mapping.unitColumn].forEach(need);
    if (mapping.layout === "analyses") need(mapping.analysisColumn);
    if (mapping.layout === "wide") {
      for (const c of mapping.columns) {
        need(c.column);
        const stream = this.findStream(c.stream);
        if (!stream) this.headerIssue(c.column, `is mapped to stream "${c.stream}", which ${site.name} does not have`);
        else if (stream.archived) this.headerIssue(c.column, `is mapped to stream "${stream.key}", which is archived`);
        else {
          const unit = c.unit ?? stream.unit;
          const unitProblem = this.unitProblem(unit, stream);
          if (unitProblem) this.headerIssue(c.column, unitProblem);
          else if (this.index.has(c.column)) this.wide.push({ col: this.index.get(c.column)!, name: c.column, stream, unit });
        }
      }
    }
    if (mapping.layout === "analyses") {
      for (const c of mapping.components) {
        need(c.column);
        if (this.index.has(c.column)) this.components.push({ col: this.index.get(c.column)!, name: c.column, component: c.component });
      }
    }
    this.headerOk = this.issues.length === 0;
  }

  private headerIssue(column: string | null, reason: string) {
    this.issues.push({ row: 1, column, reason });
  }

  private issue(row: number, column: string | null, reason: string) {
    this.issues.push({ row, column, reason });
  }

  private cell(cells: Cells, column: string): string {
    return cells[this.index.get(column)!] ?? "";
  }

  /** By stream key first, then by meter tag or key ignoring case: plant systems export tags. */
  private findStream(text: string): ImportStream | undefined {
    const t = text.trim();
    const lower = t.toLowerCase();
    return (
      this.site.streams.find((s) => s.key === t) ??
      this.site.streams.find((s) => s.meterTag?.toLowerCase() === lower || s.key.toLowerCase() === lower)
    );
  }

  private unitProblem(unit: string, stream: ImportStream): string | null {
    if (!(UNITS as readonly string[]).includes(unit)) return `"${unit}" is not a unit Synledger knows (${UNITS.join(", ")})`;
    const allowed = UNITS_BY_KIND[stream.kind];
    if (!allowed.includes(unit as Unit)) return `${unit} is not a unit for the ${stream.kind} stream "${stream.key}" (use ${allowed.join(", ")})`;
    return null;
  }

  addRow(row: number, cells: Cells): void {
    this.rowCount++;
    if (!this.headerOk) return;
    if (cells.length !== this.headers.length) {
      this.issue(row, null, `has ${cells.length} field${cells.length === 1 ? "" : "s"}; the header has ${this.headers.length} (check the delimiter and the quoting)`);
      return;
    }
    const m = this.mapping;
    const date = parseDate(this.cell(cells, m.dateColumn), m.dateFormat);
    if (!date.ok) this.issue(row, m.dateColumn, date.reason);
    const when = date.ok ? { month: date.month, day: date.day } : null;
    if (m.layout === "long") this.longRow(row, cells, when);
    else if (m.layout === "wide") this.wideRow(row, cells, when);
    else this.analysisRow(row, cells, when);
  }

  private longRow(row: number, cells: Cells, when: { month: string; day: string | null } | null) {
    if (this.mapping.layout !== "long") return;
    const { streamColumn, quantityColumn, unitColumn } = this.mapping;
    const tag = this.cell(cells, streamColumn).trim();
    let stream = tag ? this.findStream(tag) : undefined;
    if (!tag) this.issue(row, streamColumn, "the stream is empty");
    else if (!stream) this.issue(row, streamColumn, `no stream or meter tag "${tag}" at ${this.site.name}`);
    else if (stream.archived) {
      this.issue(row, streamColumn, `stream "${stream.key}" is archived`);
      stream = undefined;
    }
    const qty = parseNumber(this.cell(cells, quantityColumn), this.fmt, "quantity");
    if (!qty.ok) this.issue(row, quantityColumn, qty.reason);
    let unit = stream?.unit;
    if (unitColumn && stream) {
      const text = this.cell(cells, unitColumn).trim();
      if (text) {
        const problem = this.unitProblem(text, stream);
        if (problem) {
          this.issue(row, unitColumn, problem);
          unit = undefined;
        } else unit = text;
      }
    }
    if (when && stream && qty.ok && unit) this.add(row, when, stream, qty.value, unit, unitColumn ?? quantityColumn);
    else if (when && stream) this.markSeen(row, when, stream);
  }

  private wideRow(row: number, cells: Cells, when: { month: string; day: string | null } | null) {
    for (const w of this.wide) {
      const text = cells[w.col];
      // An empty cell is a day without a value, not an error; the partial-month warning shows it.
      if (text.trim() === "") continue;
      const qty = parseNumber(text, this.fmt, "quantity");
      if (!qty.ok) this.issue(row, w.name, qty.reason);
      if (when && qty.ok) this.add(row, when, w.stream, qty.value, w.unit, w.name);
    }
  }

  /** Duplicate (stream, day) rows are named at the second occurrence; returns false for a duplicate. */
  private markSeen(row: number, when: { month: string; day: string | null }, stream: ImportStream, column = this.mapping.dateColumn): boolean {
    const key = `${stream.key}|${when.day ?? when.month}`;
    const first = this.seen.get(key);
    if (first !== undefined) {
      this.issue(row, column, `"${stream.key}" for ${when.day ?? when.month} is already in row ${first}`);
      return false;
    }
    this.seen.set(key, row);
    return true;
  }

  /** The latest day with a value, per month (daily files): what the month's figures cover. */
  private lastDays = new Map<string, string>();

  private add(row: number, when: { month: string; day: string | null }, stream: ImportStream, value: string, unit: string, unitColumn: string) {
    if (!this.markSeen(row, when, stream)) return;
    if (when.day && when.day > (this.lastDays.get(when.month) ?? "")) this.lastDays.set(when.month, when.day);
    let month = this.sums.get(when.month);
    if (!month) this.sums.set(when.month, (month = new Map()));
    const s = month.get(stream.key);
    if (s && s.unit !== unit) {
      this.issue(row, unitColumn, `${unit} differs from ${s.unit} used for "${stream.key}" in ${when.month} (row ${s.firstRow}); use one unit per stream and month`);
      return;
    }
    this.valueCount++;
    if (s) {
      s.total = s.total.plus(value);
      s.values++;
    } else month.set(stream.key, { total: new Dec(value), unit, values: 1, firstRow: row });
  }

  private analysisRow(row: number, cells: Cells, when: { month: string; day: string | null } | null) {
    if (this.mapping.layout !== "analyses") return;
    const col = this.mapping.analysisColumn;
    const name = this.cell(cells, col).trim();
    const known = new Set(this.site.streams.map((s) => s.analysisKey).filter((k): k is string => !!k));
    let key: string | null = null;
    if (!name) this.issue(row, col, "the analysis name is empty");
    else if (known.has(name)) key = name;
    else {
      const stream = this.findStream(name);
      if (stream?.analysisKey) key = stream.analysisKey;
      else this.issue(row, col, `no analysis or gas stream "${name}" at ${this.site.name}${known.size ? ` (analyses: ${[...known].join(", ")})` : ""}`);
    }
    const components: Record<string, string> = {};
    let ok = true;
    for (const c of this.components) {
      const text = cells[c.col];
      if (text.trim() === "") continue;
      const v = parseNumber(text, this.fmt, "mol %");
      if (!v.ok) {
        this.issue(row, c.name, v.reason);
        ok = false;
      } else components[c.component] = new Dec(v.value).toFixed();
    }
    if (ok) {
      const total = Object.values(components).reduce((a, v) => a.plus(v), new Dec(0));
      if (total.minus(100).abs().gt(SUM_TOLERANCE_PCT)) {
        this.issue(row, null, `the components sum to ${total.toFixed()} mol %, more than ${SUM_TOLERANCE_PCT.toFixed()} from 100`);
        ok = false;
      }
    }
    if (!when || !key) return;
    let month = this.analyses.get(when.month);
    if (!month) this.analyses.set(when.month, (month = new Map()));
    const first = month.get(key);
    if (first) {
      this.issue(row, col, `a second sample of "${key}" for ${when.month} (the first is in row ${first.row}); import one analysis per month`);
      return;
    }
    month.set(key, { key, components, sampledOn: when.day, row });
    if (ok) this.valueCount++;
  }

  finish(): ValidationResult {
    const order = new Map(this.site.streams.map((s, i) => [s.key, i]));
    const periods = [...new Set([...this.sums.keys(), ...this.analyses.keys()])].sort();
    const daily = !isMonthFormat(this.mapping.dateFormat);
    const months: MonthPlan[] = periods.map((month) => {
      const readings = [...(this.sums.get(month) ?? new Map<string, Sum>()).entries()]
        .sort(([a], [b]) => (order.get(a) ?? 0) - (order.get(b) ?? 0))
        .map(([stream, s]) => ({ stream, quantity: s.total.toFixed(), unit: s.unit, values: s.values, firstRow: s.firstRow }));
      if (daily) {
        const days = daysInMonth(month);
        for (const r of readings) {
          if (r.values < days) this.warnings.push({ month, subject: r.stream, message: `${r.values} of ${days} days in the file: the month's total covers only those days` });
        }
      }
      return { month, readings, analyses: [...(this.analyses.get(month)?.values() ?? [])], lastDay: daily ? (this.lastDays.get(month) ?? null) : null };
    });
    return { issues: this.issues, warnings: this.warnings, months, rowCount: this.rowCount, valueCount: this.valueCount };
  }
}

type Start = { done: ValidationResult } | { validator: ImportValidator };

function start(table: CsvTable, mapping: ImportMapping, site: ImportSite): Start {
  const delimiterProblem = mapping.delimiter === "auto" ? null : wrongDelimiter(table);
  if (delimiterProblem) {
    return { done: { issues: [{ row: 1, column: null, reason: delimiterProblem }], warnings: [], months: [], rowCount: table.rows.length, valueCount: 0 } };
  }
  const validator = new ImportValidator(mapping, site, table.headers);
  for (const s of table.structural) validator.issues.push({ row: s.row, column: null, reason: s.reason });
  return { validator };
}

function end(v: ImportValidator): ValidationResult {
  const result = v.finish();
  // Structural problems are found by the parser before the rows: put every issue in file order.
  result.issues.sort((a, b) => a.row - b.row);
  return result;
}

/** Validates a whole parsed table at once (tests, small files). */
export function validateTable(table: CsvTable, mapping: ImportMapping, site: ImportSite): ValidationResult {
  const s = start(table, mapping, site);
  if ("done" in s) return s.done;
  for (const r of table.rows) s.validator.addRow(r.row, r.cells);
  return end(s.validator);
}

/** The same, pausing every `every` rows so a server can report progress and stay responsive. */
export async function validateTableInSteps(
  table: CsvTable,
  mapping: ImportMapping,
  site: ImportSite,
  every: number,
  onStep: (done: number, total: number) => Promise<void>,
): Promise<ValidationResult> {
  const s = start(table, mapping, site);
  if ("done" in s) return s.done;
  const total = table.rows.length;
  for (let i = 0; i < total; i++) {
    s.validator.addRow(table.rows[i].row, table.rows[i].cells);
    if ((i + 1) % every === 0) await onStep(i + 1, total);
  }
  await onStep(total, total);
  return end(s.validator);
}
