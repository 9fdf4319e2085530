/**
 * EXPLAIN (ANALYZE) of the queries every page and API read leans on, against the seeded fleet:
 * which plan nodes read the tables (an index scan, not a sequential scan, is what scale needs) and
 * how long the statement ran. Figures, not tests.
 */
import { sql, type SQL } from "drizzle-orm";
import type { Db } from "../db/client";
import type { BenchFleet } from "./seed";

interface PlanNode { "Node Type": string; "Relation Name"?: string; "Index Name"?: string; Plans?: PlanNode[] }

function tableReads(node: PlanNode, out: string[] = []): string[] {
  if (node["Relation Name"]) out.push(`${node["Node Type"]} on ${node["Relation Name"]}${node["Index Name"] ? ` (${node["Index Name"]})` : ""}`);
  for (const p of node.Plans ?? []) tableReads(p, out);
  return out;
}

export async function explainHotQueries(db: Db, fleet: BenchFleet): Promise<{ label: string; nodes: string[]; ms: number }[]> {
  const site = fleet.siteIds[Math.floor(fleet.siteIds.length / 2)];
  const queries: [string, SQL][] = [
    ["sites of the organisation", sql`select * from sites where organisation_id = ${fleet.organisationId} and archived_at is null order by name`],
    ["months of a site and year", sql`select * from months where site_id = ${site} and period between '2021-01' and '2021-12' order by period`],
    ["readings of a month", sql`select r.* from readings r join months m on m.id = r.month_id where m.site_id = ${site} and m.period = '2021-06'`],
    ["the organisation's audit trail, newest page", sql`select * from audit_events where organisation_id = ${fleet.organisationId} order by at desc, id desc limit 50`],
  ];
  const out: { label: string; nodes: string[]; ms: number }[] = [];
  for (const [label, q] of queries) {
    const { rows } = await db.execute<{ "QUERY PLAN": { Plan: PlanNode; "Execution Time": number }[] }>(sql`explain (analyze, format json) ${q}`);
    const plan = rows[0]["QUERY PLAN"][0];
    out.push({ label, nodes: [...new Set(tableReads(plan.Plan))], ms: plan["Execution Time"] });
  }
  return out;
}
