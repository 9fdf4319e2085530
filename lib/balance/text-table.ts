// Aligned plain-text tables for the CLI reports (month and year).
import type { Dec } from "./decimal";

/** Fixed decimals, or an em dash where a figure does not exist. */
export const fx = (x: Dec | null | undefined, places: number): string => (x === null || x === undefined ? "—" : x.toFixed(places));

/**
 * Right-aligns every column but the first and the last `leftCols` (text such as a basis or a
 * rule); the header row is underlined. Numbers right-aligned line their decimal points up.
 */
export function table(header: string[], rows: string[][], leftCols = 0): string {
  const widths = header.map((h, j) => Math.max(h.length, ...rows.map((r) => r[j].length)));
  const left = (j: number) => j === 0 || j >= header.length - leftCols;
  const line = (r: string[]) => r.map((c, j) => (left(j) ? c.padEnd(widths[j]) : c.padStart(widths[j]))).join("  ").trimEnd();
  return [line(header), widths.map((w) => "-".repeat(w)).join("  "), ...rows.map(line)].join("\n");
}
