/**
 * The one CSV writer of every export (RFC 4180 quoting, CRLF line ends). People type the names,
 * notes and labels that end up in cells, and a spreadsheet runs a cell that starts with = + - @
 * (or a tab or carriage return before them) as a formula. So such text gets a leading
 * apostrophe, while a plain decimal number (which may start with a minus) is written exactly as
 * computed. Comment lines ("# …") are written as one quoted cell: a comma inside a site name
 * cannot start a second cell there.
 */
export type CsvValue = string | number | boolean | Date | null | undefined | object;

const PLAIN_NUMBER = /^-?\d+(\.\d+)?([eE][+-]?\d+)?$/;
const FORMULA_START = /^[=+\-@\t\r]/;

function quote(s: string): string {
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function csvCell(value: CsvValue): string {
  if (value === null || value === undefined) return "";
  let s =
    typeof value === "string" ? value
    : value instanceof Date ? value.toISOString()
    : typeof value === "object" ? JSON.stringify(value)
    : String(value);
  if (!PLAIN_NUMBER.test(s) && FORMULA_START.test(s)) s = `'${s}`;
  return quote(s);
}

export const csvLine = (cells: readonly CsvValue[]): string => cells.map(csvCell).join(",");

/** A comment line: always one quoted cell, line breaks folded to spaces. */
export function csvComment(text: string): string {
  return `"${`# ${text.replace(/[\r\n]+/g, " ")}`.replace(/"/g, '""')}"`;
}

/** Comment lines, a header row and the rows, each line ended by CRLF. */
export function csvDocument(comments: readonly string[], header: readonly string[], rows: readonly (readonly CsvValue[])[]): string {
  return [...comments.map(csvComment), csvLine(header), ...rows.map(csvLine)].map((l) => `${l}\r\n`).join("");
}
