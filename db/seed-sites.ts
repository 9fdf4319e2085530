import { and, eq } from "drizzle-orm";
import { demoOrganisation, demoSeedMonths } from "@/lib/demo/scenario";
import type { DemoSite } from "@/lib/demo/scenario";
import type { Tx } from "./client";
import { recordAudit } from "./queries/audit";
import { gasAnalyses, months, readings, sites, streams } from "./schema";

const STREAM_NAMES: Record<string, string> = {
  "feed-gas": "Natural gas to reforming (feed)",
  "fuel-gas": "Natural gas to furnaces (fuel)",
  "purge-gas": "Synthesis purge gas",
  "process-air": "Process air to secondary reformer",
  ammonia: "Ammonia produced",
  "co2-export": "CO2 exported",
  "co2-vent": "CO2 vented from CO2 removal",
  "stack-co2": "CO2 in flue gas (stack monitor)",
  "electricity-import": "Electricity imported",
  "steam-import": "Steam imported",
  "steam-export": "Steam exported",
};

const seedAudit = (organisationId: string, siteId: string | null, action: string, entity: string, entityId: string, after: unknown) => ({
  organisationId,
  siteId,
  actorLabel: "demo seed",
  channel: "seed" as const,
  action,
  entity,
  entityId,
  after,
});

/** Sites, streams and the twelve months of 2026 of the demo organisation, from lib/demo. */
export async function seedDemoSites(tx: Tx, organisationId: string): Promise<void> {
  for (const site of demoOrganisation().sites) {
    const [existing] = await tx
      .select({ id: sites.id })
      .from(sites)
      .where(and(eq(sites.organisationId, organisationId), eq(sites.code, site.key)));
    if (existing) continue;
    await seedSite(tx, organisationId, site);
  }
}

async function seedSite(tx: Tx, organisationId: string, site: DemoSite): Promise<void> {
  const [row] = await tx
    .insert(sites)
    .values({
      organisationId,
      name: site.name,
      code: site.key,
      meteringReference: site.units === "us" ? "60F" : "15C",
      closureTolerancePct: "2",
      factorSet: site.method.factor_set,
      emissionsMethod: site.method.emissions,
      gwp: site.method.gwp,
      installation: site.installation,
    })
    .returning();
  await recordAudit(tx, seedAudit(organisationId, row.id, "site.created", "site", row.id, { name: site.name, code: site.key }));

  const streamIds = new Map<string, string>();
  for (const [i, s] of site.streams.entries()) {
    const [st] = await tx
      .insert(streams)
      .values({
        siteId: row.id,
        key: s.id,
        name: STREAM_NAMES[s.kind] ?? s.kind,
        kind: s.kind,
        unit: s.unit,
        analysisKey: s.analysis ?? null,
        destination: s.destination ?? null,
        fate: s.fate ?? null,
        uncertaintyPct: s.uncertainty_pct,
        indirectFactor: s.factor_t_per_MWh ?? null,
        meterTag: s.meter,
        calibratedOn: s.calibrated,
        // The demo sites calibrate every custody and process meter yearly (an invented rule of theirs).
        calibrationIntervalMonths: 12,
        sortOrder: i,
      })
      .returning();
    streamIds.set(s.id, st.id);
  }

  const seeded = demoSeedMonths(site.key);
  for (const { doc, coveredThrough } of seeded) {
    const [m] = await tx
      .insert(months)
      .values({
        siteId: row.id,
        period: doc.month,
        emissionsMethod: doc.method.emissions,
        factorSet: doc.method.factor_set,
        gwp: doc.method.gwp,
        coveredThrough,
      })
      .returning();
    for (const [key, a] of Object.entries(doc.analyses)) {
      const components = Object.fromEntries(Object.entries(a.components).map(([c, v]) => [c, v.toFixed()]));
      // Sampled on the first of the month (the running month has at least that day behind it).
      await tx.insert(gasAnalyses).values({ monthId: m.id, key, components, sampledOn: `${doc.month}-01`, laboratory: `${site.name} laboratory` });
    }
    await tx.insert(readings).values(
      doc.streams.map((s) => ({
        monthId: m.id,
        streamId: streamIds.get(s.id)!,
        quantity: s.quantity.toFixed(),
        unit: s.unit,
        source: "meter" as const,
      })),
    );
  }
  await recordAudit(tx, seedAudit(organisationId, row.id, "months.seeded", "site", row.id, { months: seeded.length, from: seeded[0]?.doc.month, to: seeded[seeded.length - 1]?.doc.month }));
}
