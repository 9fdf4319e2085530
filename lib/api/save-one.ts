import "server-only";
import type { Db } from "@/db";
import { currentMonthVersion } from "@/db/queries/api-reads";
import { findSite } from "@/db/queries/sites";
import { HttpError, notFound } from "@/lib/auth/errors";
import { saveMonthFigures, type Editor, type SaveResult } from "@/lib/ledger/save-month";
import type { MonthFiguresInput } from "@/lib/validations/month";

/** `readings[0].unit` → `unit`: a one-item route's issues name the field of its own body. */
function unwrapIssues(err: HttpError): HttpError {
  const issues = err.issues.map((i) => ({ ...i, path: i.path.replace(/^(readings|analyses)\[0\]\.?/, "") || "body" }));
  return new HttpError(err.status, err.code, err.message, issues);
}

/**
 * Saves one reading or one analysis. With an expected version it is checked as for a whole
 * month; without one the save goes against the version current now, retried once should
 * somebody else save in between (their other figures are untouched either way).
 */
export async function saveWithCurrentVersion(
  db: Db,
  editor: Editor,
  siteId: string,
  period: string,
  expectedVersion: number | undefined,
  build: (version: number) => MonthFiguresInput,
): Promise<SaveResult> {
  const attempt = async () => {
    let version = expectedVersion;
    if (version === undefined) {
      const site = await findSite(db, editor.organisationId, siteId);
      if (!site) throw notFound("The site");
      version = await currentMonthVersion(db, site.id, period);
    }
    return saveMonthFigures(db, editor, siteId, period, build(version));
  };
  try {
    try {
      return await attempt();
    } catch (err) {
      if (expectedVersion === undefined && err instanceof HttpError && err.code === "version_conflict") return await attempt();
      throw err;
    }
  } catch (err) {
    throw err instanceof HttpError ? unwrapIssues(err) : err;
  }
}
