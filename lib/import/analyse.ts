import "server-only";
import { createHash } from "node:crypto";
import type { Db } from "@/db/client";
import { firstBatchOfFile, importStreams, monthsWithReadings } from "@/db/queries/imports";
import { findSite } from "@/db/queries/sites";
import { HttpError, notFound, zodIssues } from "@/lib/auth/errors";
import { READ_ONLY_STATES } from "@/lib/ledger/save-month";
import { CsvFileError, decodeCsv, parseCsv } from "./csv";
import { MAX_IMPORT_BYTES, MAX_IMPORT_ROWS, PROGRESS_EVERY_ROWS, formatCount } from "./limits";
import { importMappingSchema, type ImportMapping } from "./mapping";
import type { Emit } from "./progress-response";
import { formFile, readLimitedForm } from "./read-multipart";
import type { ImportIssue, ValidationResult } from "./types";
import { validateTableInSteps } from "./validate";

export interface ImportRequest {
  fileName: string;
  bytes: Buffer;
  mapping: ImportMapping;
  /** The user has seen that this file was imported before and wants its figures written again. */
  confirmReplace: boolean;
}

/** multipart/form-data: `file`, `mapping` (JSON text) and optionally `confirmReplace=true`. */
export async function readImportRequest(req: Request): Promise<ImportRequest> {
  const form = await readLimitedForm(req, MAX_IMPORT_BYTES);
  const file = await formFile(form, MAX_IMPORT_BYTES);
  let raw: unknown;
  try {
    raw = JSON.parse(String(form.get("mapping") ?? ""));
  } catch {
    throw new HttpError(400, "invalid_input", "The column mapping is missing or not JSON.", [{ path: "mapping", message: "send the mapping as JSON text" }]);
  }
  const parsed = importMappingSchema.safeParse(raw);
  if (!parsed.success) {
    throw new HttpError(400, "invalid_input", "The column mapping needs attention.", zodIssues(parsed.error.issues).map((i) => ({ ...i, path: `mapping.${i.path}` })));
  }
  return { fileName: file.name, bytes: file.bytes, mapping: parsed.data, confirmReplace: form.get("confirmReplace") === "true" };
}

export function issuePath(i: ImportIssue): string {
  return i.column ? `row ${i.row}, ${i.column}` : `row ${i.row}`;
}

export interface Analysis {
  site: { id: string; name: string; emissionsMethod: string; factorSet: string; gwp: string };
  sha256: string;
  delimiter: string;
  headers: string[];
  result: ValidationResult;
  months: { month: string; state: string | null; version: number; readOnly: boolean; current: { stream: string; quantity: string; unit: string }[] }[];
  previous: Awaited<ReturnType<typeof firstBatchOfFile>>;
}

/**
 * Everything the preview shows and the commit re-checks: the file is parsed and validated again
 * on every call, so a commit never relies on what a browser says the preview found.
 */
export async function analyseImport(db: Db, organisationId: string, siteId: string, request: ImportRequest, emit: Emit): Promise<Analysis> {
  const site = await findSite(db, organisationId, siteId);
  if (!site) throw notFound("The site");
  const sha256 = createHash("sha256").update(request.bytes).digest("hex");
  let text: string;
  try {
    text = decodeCsv(request.bytes);
  } catch (err) {
    if (err instanceof CsvFileError) throw new HttpError(400, "invalid_file", err.message, [{ path: "file", message: err.message }]);
    throw err;
  }
  const table = parseCsv(text, request.mapping.delimiter, MAX_IMPORT_ROWS);
  if (table.rows.length > MAX_IMPORT_ROWS) {
    throw new HttpError(413, "too_many_rows", `"${request.fileName}" has more than ${formatCount(MAX_IMPORT_ROWS)} data rows, the limit of one import; split it by month.`);
  }
  if (table.rows.length === 0) throw new HttpError(400, "invalid_file", `"${request.fileName}" has a header but no data rows.`);
  await emit({ phase: "parse", done: table.rows.length, total: table.rows.length });
  const streams = await importStreams(db, site.id);
  const result = await validateTableInSteps(table, request.mapping, { name: site.name, streams }, PROGRESS_EVERY_ROWS, (done, total) =>
    emit({ phase: "validate", done, total }),
  );
  const stored = await monthsWithReadings(db, site.id, result.months.map((m) => m.month));
  const months = result.months.map(({ month }) => {
    const m = stored.find((s) => s.period === month);
    return {
      month,
      state: m?.state ?? null,
      version: m?.version ?? 0,
      readOnly: !!m && (READ_ONLY_STATES as readonly string[]).includes(m.state),
      current: (m?.readings ?? []).map(({ stream, quantity, unit }) => ({ stream, quantity, unit })),
    };
  });
  const previous = await firstBatchOfFile(db, site.id, sha256);
  return { site: { id: site.id, name: site.name, emissionsMethod: site.emissionsMethod, factorSet: site.factorSet, gwp: site.gwp }, sha256, delimiter: table.delimiter, headers: table.headers, result, months, previous };
}
