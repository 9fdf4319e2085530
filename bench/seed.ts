/**
 * Ten years of a 50-site fleet, written the way the product stores it: one reading per stream
 * and month, each the exact sum of that month's daily meter totals (generated in PostgreSQL, so
 * 1.8 million daily values become 60 000 monthly readings in a few seconds), plus the month's
 * two gas analyses. Streams and compositions are those of the demo's Estuary example file.
 */
import { readFileSync } from "node:fs";
import { sql } from "drizzle-orm";
import type { Db } from "../db/client";
import { memberships, organisations, sites, streams, users } from "../db/schema";
import { hashPassword } from "../lib/auth/password";
import { ROLES } from "../lib/auth/roles";

export const BENCH_PASSWORD = "Bench#Ledger2026";
/** 500 sites × 10 years by default (issue 19's scale); BENCH_SITES sets another fleet size. */
export const SITE_COUNT = Number(process.env.BENCH_SITES ?? 500);
export const FIRST_MONTH = "2016-01";
export const LAST_MONTH = "2025-12";

interface ExampleStream {
  id: string;
  kind: string;
  analysis?: string;
  fate?: string;
  destination?: string;
  quantity: string;
  unit: string;
  uncertainty_pct?: string;
  meter?: string;
}
export const EXAMPLE_TEXT = readFileSync("examples/estuary-2026-03.json", "utf8");
const example = JSON.parse(EXAMPLE_TEXT) as { streams: ExampleStream[]; analyses: Record<string, { components: Record<string, string> }> };

export interface BenchFleet {
  organisationId: string;
  email: string;
  userId: string;
  userName: string;
  organisationName: string;
  siteIds: string[];
  readings: number;
  months: number;
}

export async function seedFleet(db: Db): Promise<BenchFleet> {
  const tag = Date.now().toString(36);
  const [org] = await db.insert(organisations).values({ name: `Bench fleet ${tag}`, slug: `bench-${tag}` }).returning();
  const email = `bench.${tag}@bench.example`;
  const [user] = await db.insert(users).values({ email, name: "Bench engineer", passwordHash: await hashPassword(BENCH_PASSWORD) }).returning();
  await db.insert(memberships).values({ userId: user.id, organisationId: org.id, roles: [...ROLES] });
  const siteRows = await db
    .insert(sites)
    .values(Array.from({ length: SITE_COUNT }, (_, i) => ({ organisationId: org.id, name: `Works ${String(i + 1).padStart(2, "0")}`, code: `w${i + 1}-${tag}` })))
    .returning({ id: sites.id });
  await db.insert(streams).values(
    siteRows.flatMap((s) =>
      example.streams.map((x, i) => ({
        siteId: s.id,
        key: x.id,
        name: x.id,
        kind: x.kind as typeof streams.$inferInsert.kind,
        unit: x.unit,
        analysisKey: x.analysis ?? null,
        fate: x.fate ?? null,
        destination: x.destination ?? null,
        uncertaintyPct: x.uncertainty_pct ?? null,
        meterTag: x.meter ?? null,
        sortOrder: i,
      })),
    ),
  );
  await db.execute(sql`
    INSERT INTO months (site_id, period, version, emissions_method, factor_set, gwp)
    SELECT s.id, to_char(d, 'YYYY-MM'), 1, s.emissions_method, s.factor_set, s.gwp
    FROM sites s, generate_series(${`${FIRST_MONTH}-01`}::date, ${`${LAST_MONTH}-01`}::date, interval '1 month') d
    WHERE s.organisation_id = ${org.id}`);
  // Daily totals scatter ±10 % around the example's monthly figure / 30, three decimals each; the
  // month's reading is their exact numeric sum.
  const base = sql.join(example.streams.map((x) => sql`(${x.id}, ${x.quantity}::numeric)`), sql`, `);
  const written = await db.execute(sql`
    INSERT INTO readings (month_id, stream_id, quantity, unit)
    SELECT m.id, st.id, sum(round(b.q / 30 * (0.9 + 0.2 * random())::numeric, 3)), st.unit
    FROM months m
    JOIN sites s ON s.id = m.site_id AND s.organisation_id = ${org.id}
    JOIN streams st ON st.site_id = m.site_id
    JOIN (VALUES ${base}) AS b(key, q) ON b.key = st.key
    CROSS JOIN LATERAL generate_series(to_date(m.period, 'YYYY-MM'), to_date(m.period, 'YYYY-MM') + interval '1 month' - interval '1 day', interval '1 day') AS day
    GROUP BY m.id, st.id, st.unit`);
  for (const [key, a] of Object.entries(example.analyses)) {
    await db.execute(sql`
      INSERT INTO gas_analyses (month_id, key, components)
      SELECT m.id, ${key}, ${JSON.stringify(a.components)}::jsonb
      FROM months m JOIN sites s ON s.id = m.site_id AND s.organisation_id = ${org.id}`);
  }
  return {
    organisationId: org.id,
    organisationName: org.name,
    email,
    userId: user.id,
    userName: user.name,
    siteIds: siteRows.map((s) => s.id),
    readings: written.rowCount ?? 0,
    months: SITE_COUNT * 120,
  };
}
