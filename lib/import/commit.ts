import "server-only";
import { sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { recordAudit } from "@/db/queries/audit";
import { firstBatchOfFile, insertBatch, saveMapping } from "@/db/queries/imports";
import { lockMonth } from "@/db/queries/months";
import { formatDateTime } from "@/reports/format";
import { HttpError } from "@/lib/auth/errors";
import type { Unit } from "@/lib/balance/units";
import type { Actor } from "@/lib/auth/guard";
import { READ_ONLY_STATES, saveMonthFigures } from "@/lib/ledger/save-month";
import { analyseImport, issuePath, type Analysis, type ImportRequest } from "./analyse";
import type { Emit } from "./progress-response";

const STATE_WORDS: Record<string, string> = { in_review: "in review", signed: "signed", submitted: "submitted" };

/** What the wizard's check step shows. `canCommit` is advice; the commit checks everything again. */
export function previewBody(request: ImportRequest, a: Analysis) {
  const readOnly = a.months.filter((m) => m.readOnly);
  return {
    fileName: request.fileName,
    sizeBytes: request.bytes.length,
    sha256: a.sha256,
    delimiter: a.delimiter,
    headers: a.headers,
    rowCount: a.result.rowCount,
    valueCount: a.result.valueCount,
    issues: a.result.issues,
    warnings: a.result.warnings,
    months: a.result.months.map((plan, i) => ({ ...plan, ...a.months[i] })),
    previousImport: a.previous && { batchId: a.previous.id, fileName: a.previous.fileName, importedAt: a.previous.importedAt, importedBy: a.previous.importedBy },
    canCommit: a.result.issues.length === 0 && readOnly.length === 0 && a.result.months.length > 0,
  };
}
export type PreviewBody = ReturnType<typeof previewBody>;

function alreadyImported(p: NonNullable<Analysis["previous"]>): HttpError {
  return new HttpError(
    409,
    "already_imported",
    `This file was already imported on ${formatDateTime(p.importedAt)}${p.importedBy ? ` by ${p.importedBy}` : ""} (as "${p.fileName}"). Confirm a re-import to write its figures again.`,
  );
}

/**
 * Writes a validated file in ONE transaction: every month's readings and analyses through the
 * month service (optimistic version taken under the row lock, audit per change, channel
 * "import"), the batch record, the saved mapping and an audit event for the batch. A bad row,
 * a read-only month or a second import of the same file refuses the whole file.
 */
export async function commitImport(db: Db, actor: Actor, siteId: string, request: ImportRequest, emit: Emit) {
  const a = await analyseImport(db, actor.organisationId, siteId, request, emit);
  const { issues, months: plans } = a.result;
  if (issues.length) {
    throw new HttpError(
      400,
      "invalid_rows",
      `The file has ${issues.length} problem${issues.length === 1 ? "" : "s"}; nothing was imported.`,
      issues.map((i) => ({ path: issuePath(i), message: i.reason })),
    );
  }
  if (plans.length === 0) throw new HttpError(400, "invalid_rows", "The file holds no values to import.");
  const editor = { organisationId: actor.organisationId, userId: actor.userId, label: actor.name, channel: "import" as const };

  const written = await db.transaction(async (tx) => {
    // Two people committing the same file at once: the second waits here, then finds the first batch.
    await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`import:${a.site.id}:${a.sha256}`}, 0))`);
    const previous = await firstBatchOfFile(tx, a.site.id, a.sha256);
    if (previous && !request.confirmReplace) throw alreadyImported(previous);
    // Lock every month first, in order, so the read-only check holds until the commit ends.
    const locked = [];
    for (const plan of plans) locked.push(await lockMonth(tx, a.site, plan.month));
    const frozen = locked.filter((m) => (READ_ONLY_STATES as readonly string[]).includes(m.state));
    if (frozen.length) {
      throw new HttpError(
        409,
        "month_read_only",
        `${frozen.map((m) => `${m.period} is ${STATE_WORDS[m.state] ?? m.state}`).join("; ")}: ${frozen.length === 1 ? "its" : "their"} figures can no longer be changed, so nothing was imported. Reopen the month first or remove its rows from the file.`,
      );
    }
    const results = [];
    for (const [i, plan] of plans.entries()) {
      // The month service opens a nested transaction on `tx`, i.e. a savepoint: each month's save
      // keeps its own checks and audit, and still stands or falls with the whole import.
      const saved = await saveMonthFigures(tx as unknown as Db, editor, a.site.id, plan.month, {
        expectedVersion: locked[i].version,
        readings: plan.readings.map((r) => ({ stream: r.stream, quantity: r.quantity, unit: r.unit as Unit, source: "meter" })),
        analyses: plan.analyses.map((x) => ({ key: x.key, components: x.components, ...(x.sampledOn ? { sampledOn: x.sampledOn } : {}) })),
      }, plan.lastDay ? { coveredThrough: plan.lastDay } : {});
      results.push({ month: plan.month, readings: plan.readings.length, analyses: plan.analyses.length, changed: saved.changed, version: saved.version });
      await emit({ phase: "commit", done: i + 1, total: plans.length });
    }
    const summary = { mapping: request.mapping.name, layout: request.mapping.layout, months: results, replaces: previous?.id ?? null };
    const batch = await insertBatch(tx, {
      siteId: a.site.id,
      fileName: request.fileName,
      fileSha256: a.sha256,
      rowCount: a.result.rowCount,
      summary,
      importedBy: actor.userId,
    });
    await saveMapping(tx, a.site.id, request.mapping.name, request.mapping);
    await recordAudit(tx, {
      organisationId: actor.organisationId,
      siteId: a.site.id,
      actorUserId: actor.userId,
      actorLabel: actor.name,
      channel: "import",
      action: previous ? "import.replaced" : "import.committed",
      entity: "import_batch",
      entityId: batch.id,
      after: { fileName: request.fileName, sha256: a.sha256, rows: a.result.rowCount, ...summary },
      reason: previous ? `re-import confirmed; first imported ${previous.importedAt.toISOString()}` : null,
    });
    return { batchId: batch.id, importedAt: batch.importedAt, months: results, previous };
  });
  const { previous, ...rest } = written;
  return {
    ...rest,
    fileName: request.fileName,
    rowCount: a.result.rowCount,
    valueCount: a.result.valueCount,
    warnings: a.result.warnings,
    changed: written.months.reduce((n, m) => n + m.changed, 0),
    replaced: previous ? { batchId: previous.id, importedAt: previous.importedAt } : null,
  };
}
export type CommitBody = Awaited<ReturnType<typeof commitImport>>;
