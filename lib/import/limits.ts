/**
 * Limits of one CSV import, shared by the wizard (to refuse early, before uploading) and the
 * server (which refuses again, since the browser's check can be bypassed). 10 MiB holds about
 * a year of daily totals for a few hundred tags; bigger exports should be split by month.
 */
export const MAX_IMPORT_BYTES = 10 * 1024 * 1024;
export const MAX_IMPORT_ROWS = 200_000;
/** Rows validated between two progress reports (and two yields to the event loop). */
export const PROGRESS_EVERY_ROWS = 5_000;

export function formatBytes(n: number): string {
  if (n < 1024) return `${n} B`;
  if (n < 1024 * 1024) return `${(n / 1024).toFixed(1)} KiB`;
  return `${(n / 1024 / 1024).toFixed(1)} MiB`;
}

/** 200000 → "200 000": a thin space is unambiguous whatever the reader's decimal habit. */
export function formatCount(n: number): string {
  return String(n).replace(/\B(?=(\d{3})+(?!\d))/g, "\u202f");
}
