import "server-only";
import type { Db } from "@/db";
import { HttpError } from "@/lib/auth/errors";
import { saveMonthFigures, type Editor, type SaveResult } from "@/lib/ledger/save-month";
import type { MonthFiguresInput } from "@/lib/validations/month";

/** `readings[0].unit` → `unit`: a one-item route's issues name the field of its own body. */
function unwrapIssues(err: HttpError): HttpError {
  const issues = err.issues.map((i) => ({ ...i, path: i.path.replace(/^(readings|analyses)\[0\]\.?/, "") || "body" }));
  return new HttpError(err.status, err.code, err.message, issues);
}

/**
 * Saves one reading or one analysis. With an expected version it is checked as for a whole
 * month; without one the save goes against the version current when the month is locked, so
 * several plant systems sending different streams at once queue rather than refuse each other
 * (their other figures are untouched either way).
 */
export async function saveOne(
  db: Db,
  editor: Editor,
  siteId: string,
  period: string,
  expectedVersion: number | undefined,
  figures: Omit<MonthFiguresInput, "expectedVersion">,
): Promise<SaveResult> {
  try {
    return await saveMonthFigures(db, editor, siteId, period, { ...figures, expectedVersion: expectedVersion ?? 0 }, { againstCurrentVersion: expectedVersion === undefined });
  } catch (err) {
    throw err instanceof HttpError ? unwrapIssues(err) : err;
  }
}
