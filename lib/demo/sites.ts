import type { InstallationIdentity } from "@/lib/validations/installation";
// The invented demo organisation "Vellmar Nitrogen Co." and its two fictional sites. Meter
// tags, gas analyses and calibration dates are our own inventions.
import type { Component } from "../balance/components";
import type { PlantMonth } from "../balance/schema";
import type { StreamKind } from "../balance/types";
import type { Unit } from "../balance/units";

export type SiteKey = "estuary" | "dunmoor";

export interface DemoStream {
  id: string;
  kind: StreamKind;
  unit: Unit;
  uncertainty_pct: string | null;
  meter: string;
  calibrated: string; // date of last calibration, YYYY-MM-DD
  analysis?: string;
  fate?: "fuel" | "flare" | "vent";
  destination?: "urea" | "storage" | "sale" | "other";
  factor_t_per_MWh?: string;
}

export interface DemoSite {
  key: SiteKey;
  name: string;
  units: "metric" | "us";
  nh3_t_per_day: string;
  method: PlantMonth["method"];
  analyses: Record<string, Partial<Record<Component, string>>>;
  streams: DemoStream[];
  /** Build parameters: purge per NH3 (mol/mol), share of process CO2 exported, energy per t, power per t. */
  design: { purge_per_nh3: string; export_share: string; gj_lhv_per_t: [string, string]; mwh_per_t: string };
  /** A month with a deliberately drifting meter, so the balances and reconciliation show it. */
  drift: { month: string; stream: string; factor: string };
  /** The invented installation identity its statements carry. */
  installation: InstallationIdentity;
}

export interface DemoOrganisation {
  name: string;
  sites: DemoSite[];
}

const PURGE = { H2: "56.0", N2: "23.5", CH4: "13.2", Ar: "5.6", NH3: "1.7" };

const ESTUARY: DemoSite = {
  key: "estuary",
  name: "Estuary Works",
  units: "metric",
  nh3_t_per_day: "1500",
  method: { emissions: "carbon-mass-balance", factor_set: "ipcc-2006", gwp: "AR5" },
  analyses: {
    "estuary-grid-gas": { CH4: "92.40", C2H6: "4.10", C3H8: "0.80", iC4H10: "0.10", nC4H10: "0.15", nC5H12: "0.05", N2: "1.20", CO2: "1.20" },
    "estuary-purge": PURGE,
  },
  streams: [
    { id: "feed", kind: "feed-gas", analysis: "estuary-grid-gas", unit: "Sm3", uncertainty_pct: "1.0", meter: "EW-FQ-101", calibrated: "2025-10-14" },
    { id: "fuel", kind: "fuel-gas", analysis: "estuary-grid-gas", unit: "Sm3", uncertainty_pct: "1.5", meter: "EW-FQ-102", calibrated: "2025-10-14" },
    { id: "air", kind: "process-air", unit: "Nm3", uncertainty_pct: "2.0", meter: "EW-FQ-201", calibrated: "2025-06-03" },
    { id: "purge", kind: "purge-gas", analysis: "estuary-purge", fate: "fuel", unit: "Nm3", uncertainty_pct: "3.0", meter: "EW-FQ-401", calibrated: "2025-06-03" },
    { id: "nh3", kind: "ammonia", unit: "t", uncertainty_pct: "0.5", meter: "EW-WQ-501", calibrated: "2025-12-01" },
    { id: "co2-urea", kind: "co2-export", destination: "urea", unit: "t", uncertainty_pct: "1.0", meter: "EW-FQ-301", calibrated: "2025-09-22" },
    { id: "co2-vent", kind: "co2-vent", unit: "t", uncertainty_pct: "5.0", meter: "EW-AQ-302", calibrated: "2025-09-22" },
    { id: "stack", kind: "stack-co2", unit: "t", uncertainty_pct: "5.0", meter: "EW-AQ-601", calibrated: "2025-11-18" },
    { id: "power", kind: "electricity-import", unit: "MWh", uncertainty_pct: "0.5", meter: "EW-EQ-001", calibrated: "2025-01-30", factor_t_per_MWh: "0.210" },
  ],
  design: { purge_per_nh3: "0.085", export_share: "0.88", gj_lhv_per_t: ["29.2", "30.4"], mwh_per_t: "0.065" },
  drift: { month: "2026-08", stream: "feed", factor: "1.04" },
  installation: {
    operatorName: "Vellmar Nitrogen Company Limited",
    identifiers: [
      { scheme: "EU ETS permit", identifier: "NM-GHG-0417" },
      { scheme: "EU ETS installation identifier", identifier: "NM-000417" },
    ],
    address: "Estuary Works, 12 Saltmarsh Quay, Harrowby NM4 7QT, Northmere",
    competentAuthority: "Northmere Environment Agency, Emissions Trading Unit",
    monitoringPlanRef: "MP-EW-2021-03",
    monitoringPlanVersion: "4",
    contactName: "Maren Holt",
    contactEmail: "emissions.estuary@vellmar.example",
    contactPhone: "+44 1632 960 417",
  },
};

const DUNMOOR: DemoSite = {
  key: "dunmoor",
  name: "Dunmoor Works",
  units: "us",
  nh3_t_per_day: "1100",
  method: { emissions: "fuel-calculation", factor_set: "us-40cfr98", gwp: "AR5" },
  analyses: {
    "dunmoor-pipeline": { CH4: "95.10", C2H6: "2.60", C3H8: "0.45", iC4H10: "0.08", nC4H10: "0.09", N2: "0.88", CO2: "0.80" },
    "dunmoor-purge": PURGE,
  },
  streams: [
    { id: "feed", kind: "feed-gas", analysis: "dunmoor-pipeline", unit: "MMscf", uncertainty_pct: "1.0", meter: "DM-FT-1010", calibrated: "2025-08-07" },
    { id: "fuel", kind: "fuel-gas", analysis: "dunmoor-pipeline", unit: "MMBtu-HHV", uncertainty_pct: "1.5", meter: "DM-FT-1020", calibrated: "2024-11-19" },
    { id: "air", kind: "process-air", unit: "Mscf", uncertainty_pct: "2.5", meter: "DM-FT-2010", calibrated: "2025-04-15" },
    { id: "purge", kind: "purge-gas", analysis: "dunmoor-purge", fate: "fuel", unit: "Mscf", uncertainty_pct: "3.0", meter: "DM-FT-4010", calibrated: "2025-04-15" },
    { id: "nh3", kind: "ammonia", unit: "t", uncertainty_pct: "0.5", meter: "DM-WT-5010", calibrated: "2025-12-09" },
    { id: "co2-sale", kind: "co2-export", destination: "sale", unit: "t", uncertainty_pct: "0.75", meter: "DM-FT-3010", calibrated: "2025-10-02" },
    { id: "co2-vent", kind: "co2-vent", unit: "t", uncertainty_pct: "3.0", meter: "DM-AT-3020", calibrated: "2025-10-02" },
    { id: "stack", kind: "stack-co2", unit: "t", uncertainty_pct: "2.5", meter: "DM-AT-6010", calibrated: "2025-03-26" },
    { id: "power", kind: "electricity-import", unit: "MWh", uncertainty_pct: "0.5", meter: "DM-ET-0001", calibrated: "2025-02-11" },
  ],
  design: { purge_per_nh3: "0.095", export_share: "0.45", gj_lhv_per_t: ["29.6", "30.8"], mwh_per_t: "0.090" },
  drift: { month: "2026-10", stream: "fuel", factor: "1.10" },
  installation: {
    operatorName: "Vellmar Nitrogen (Dunmoor) LLC",
    identifiers: [{ scheme: "US EPA GHGRP facility ID", identifier: "DM-552187" }],
    address: "Dunmoor Works, 4400 Prairie Rail Road, Dunmoor, KS 67999, United States",
    competentAuthority: "U.S. Environmental Protection Agency, Greenhouse Gas Reporting Program",
    monitoringPlanRef: "GHG-MP-DM-2019",
    monitoringPlanVersion: "7",
    contactName: "Maren Holt",
    contactEmail: "ghg.dunmoor@vellmar.example",
    contactPhone: "+1 620 555 0144",
  },
};

export function demoOrganisation(): DemoOrganisation {
  return { name: "Vellmar Nitrogen Co.", sites: [ESTUARY, DUNMOOR] };
}

export function demoSite(key: SiteKey): DemoSite {
  const site = demoOrganisation().sites.find((s) => s.key === key);
  if (!site) throw new Error(`unknown demo site ${key}`);
  return site;
}
