import { getDb } from "@/db";
import { loadSiteYear, seriesOf } from "@/lib/ledger/site-year";
import { HttpError, notFound } from "@/lib/auth/errors";
import { v1Route } from "@/lib/api/route";
import { annualReportCsv, exportName, monthStreamsCsv, ruleSetsCsv, sourcesCsv, yearCsv, yearDocument, yearParam } from "@/lib/ledger/exports";
import { isMonthOfYear } from "@/lib/period";
import { endedRuns, yearBySource, yearEuEtsAndCbam, yearUnderEachFactorSet } from "@/lib/ledger/year";

type Params = { siteId: string; year: string };

const TABLES = ["months", "streams", "sources", "rule-sets", "annual-report"] as const;
type Table = (typeof TABLES)[number];

const bad = (path: string, message: string) => new HttpError(400, "invalid_input", `The ${path} parameter is not valid: ${message}.`, [{ path, message }]);

function download(body: string, type: string, name: string) {
  return new Response(body, {
    headers: {
      "Content-Type": `${type}; charset=utf-8`,
      "Content-Disposition": `attachment; filename="${name}"`,
      "Cache-Control": "private, no-store",
    },
  });
}

/**
 * GET /api/v1/sites/{siteId}/years/{year}/export?format=csv|json[&month=YYYY-MM][&table=…]
 * - csv, no month: one row per month and the year's total (table=months), or the annual tables
 *   table=sources (emissions by source) and table=rule-sets (the year under each factor set);
 * - csv with month: one row per stream of that month (table=streams, implied);
 * - json: the plant-month documents of the year in one document, or one month's document.
 * A year without months exports headers only, so a script can tell "nothing yet" from an error.
 */
export const GET = v1Route<Params>({ permission: "org:read", what: "export years" }, async (req, caller, { siteId, year }) => {
  // The path's year is checked before anything else reads it.
  const y4 = yearParam(year);
  const q = new URL(req.url).searchParams;
  const format = q.get("format") ?? "csv";
  if (format !== "csv" && format !== "json") throw bad("format", "use csv or json");
  const month = q.get("month");
  if (month !== null && !isMonthOfYear(month, y4)) throw bad("month", `write a month of ${y4} as YYYY-MM`);
  const table = (q.get("table") ?? (month ? "streams" : "months")) as Table;
  if (!TABLES.includes(table)) throw bad("table", `use one of ${TABLES.join(", ")}`);
  if ((table === "streams") !== (month !== null)) throw bad("table", "streams goes with a month, the other tables with the whole year");

  const y = await loadSiteYear(getDb(), caller.organisationId, siteId, y4);
  if (!y) throw notFound("The site");
  const run = month ? y.runs.find((r) => r.period === month) : undefined;
  if (month && !run) throw new HttpError(404, "not_found", `No figures have been entered for ${month} at ${y.site.name} yet.`);

  if (format === "json" && table === "annual-report") {
    const figures = yearEuEtsAndCbam(y4, y.runs);
    if (!figures) throw new HttpError(404, "not_found", `No ended month of ${y4} computes at ${y.site.name} yet.`);
    return download(`${JSON.stringify({ format: "synledger.annual-report-content/1", site: y.site.code, year: y4, ...figures.annualReport, eu_ets: figures.euEts }, null, 2)}\n`, "application/json", exportName(y.site.code, year, "json", "annual-report"));
  }
  if (format === "json") {
    const body = run ? run.document : yearDocument(y.site, year, y.runs);
    return download(`${JSON.stringify(body, null, 2)}\n`, "application/json", exportName(y.site.code, month ?? year, "json"));
  }
  const series = seriesOf(y);
  const name = exportName(y.site.code, month ?? year, "csv", table === "months" || table === "streams" ? undefined : table);
  if (run) return download(monthStreamsCsv(y.site, run), "text/csv", name);
  if (table === "sources") return download(sourcesCsv(series, yearBySource(endedRuns(y.runs))), "text/csv", name);
  if (table === "annual-report") {
    const figures = yearEuEtsAndCbam(y4, y.runs);
    if (!figures) throw new HttpError(404, "not_found", `No ended month of ${y4} computes at ${y.site.name} yet.`);
    return download(annualReportCsv(series, figures.annualReport), "text/csv", name);
  }
  if (table === "rule-sets") {
    const recorded = [...new Set(series.months.flatMap((m) => (m.method ? [m.method.factor_set] : [])))];
    return download(ruleSetsCsv(series, yearUnderEachFactorSet(endedRuns(y.runs).map((r) => r.document), y.site.closureTolerancePct, recorded)), "text/csv", name);
  }
  return download(yearCsv(series), "text/csv", name);
});
