import Papa from "papaparse";
import type { Delimiter } from "./mapping";

/**
 * Reading the bytes of a CSV file into a table of text cells. Browser-safe (the wizard uses it
 * to show the columns before anything is uploaded) and used again by the server, which never
 * trusts what the browser saw.
 */
export class CsvFileError extends Error {}

const GUESSABLE = [",", ";", "\t", "|"] as const;
export const DELIMITER_NAMES: Record<string, string> = { ",": "comma", ";": "semicolon", "\t": "tab", "|": "vertical bar" };

/** UTF-8 text without its byte-order mark; other encodings are refused with what to do instead. */
export function decodeCsv(bytes: Uint8Array, { lenient = false } = {}): string {
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    throw new CsvFileError("The file is UTF-16 text; save it as \"CSV UTF-8\" and upload it again.");
  }
  if (bytes.includes(0)) throw new CsvFileError("The file contains NUL bytes: it is not a text (CSV) file.");
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: !lenient }).decode(bytes);
  } catch {
    throw new CsvFileError("The file is not UTF-8 text (perhaps Windows-1252 or Latin-1); save it as \"CSV UTF-8\" and upload it again.");
  }
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}

export interface CsvTable {
  delimiter: string;
  headers: string[];
  /** Data rows with their row number as a spreadsheet shows it (the header is row 1). */
  rows: { row: number; cells: string[] }[];
  /** Problems of the file's structure (unclosed quotes), by row. */
  structural: { row: number; reason: string }[];
}

/** The delimiter the header line most plausibly uses: the candidate that splits it most often. */
export function guessDelimiter(text: string): string {
  const firstLine = text.slice(0, text.search(/\r?\n|$/));
  let best: string = ",";
  let bestCount = 0;
  for (const d of GUESSABLE) {
    const count = firstLine.split(d).length - 1;
    if (count > bestCount) [best, bestCount] = [d, count];
  }
  return best;
}

export function parseCsv(text: string, delimiter: Delimiter, maxRows = Infinity): CsvTable {
  const used = delimiter === "auto" ? guessDelimiter(text) : delimiter;
  // Empty lines are kept (and skipped below) so row numbers stay those of the file. One row past
  // the limit is read, so the caller can tell "at the limit" from "over it".
  const result = Papa.parse<string[]>(text, { delimiter: used, skipEmptyLines: false, preview: maxRows === Infinity ? 0 : maxRows + 2 });
  const data = result.data;
  while (data.length && data[data.length - 1].length === 1 && data[data.length - 1][0] === "") data.pop();
  const headers = (data[0] ?? []).map((h) => h.trim());
  const rows: CsvTable["rows"] = [];
  for (let i = 1; i < data.length; i++) {
    const cells = data[i];
    if (cells.length === 1 && cells[0].trim() === "") continue;
    rows.push({ row: i + 1, cells });
  }
  const structural = result.errors
    .filter((e) => e.code !== "UndetectableDelimiter" && e.type !== "FieldMismatch")
    .map((e) => ({ row: (e.row ?? 0) + 1, reason: e.code === "MissingQuotes" ? "a quoted field is not closed" : e.message }));
  return { delimiter: used, headers, rows, structural };
}

/**
 * When the mapping names a delimiter the file does not use, the header comes back as one
 * column that contains another candidate: say which one, rather than "column not found" N times.
 */
export function wrongDelimiter(table: CsvTable): string | null {
  if (table.headers.length !== 1) return null;
  const header = table.headers[0];
  const other = GUESSABLE.find((d) => d !== table.delimiter && header.includes(d));
  if (!other) return null;
  return `the header is one single column "${header.length > 60 ? `${header.slice(0, 60)}…` : header}": the file looks ${DELIMITER_NAMES[other]}-separated, but the mapping says ${DELIMITER_NAMES[table.delimiter] ?? JSON.stringify(table.delimiter)}`;
}
