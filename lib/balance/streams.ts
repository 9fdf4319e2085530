// Per-stream conversion: each stream of a plant-month becomes a StreamFigures record
// (docs/engine-contract.md) plus the per-mole facts the element balances need.
import { DRY_AIR_PCT } from "./components";
import { Dec, ONE } from "./decimal";
import { type GasProperties, compositionOf, gasProperties } from "./gas-properties";
import type { PlantMonth, PlantMonthStream } from "./schema";
import type { Flag, StreamFigures } from "./types";
import { UNIT_DEFS, materialAmounts, toGj, toKmol } from "./units";

export const DRY_AIR: GasProperties = gasProperties(compositionOf(DRY_AIR_PCT));
export const PURE_NH3: GasProperties = gasProperties(compositionOf({ NH3: "100" }));
export const PURE_CO2: GasProperties = gasProperties(compositionOf({ CO2: "100" }));

export interface StreamFlow {
  stream: PlantMonthStream;
  figures: StreamFigures;
  /** Composition the quantity was read through (null for electricity and steam). */
  gas: GasProperties | null;
  /** kmol per unit of quantity: the stream's linear coefficient for reconciliation. */
  kmolPerUnit: Dec | null;
}

/** Gas properties of every analysis in the document, with a warning flag for each one normalised. */
export function analysesOf(doc: PlantMonth): { gases: Record<string, GasProperties>; flags: Flag[] } {
  const gases: Record<string, GasProperties> = {};
  const flags: Flag[] = [];
  for (const [id, a] of Object.entries(doc.analyses)) {
    const g = gasProperties(a.components);
    gases[id] = g;
    if (g.normalised)
      flags.push({
        code: "composition-normalised",
        severity: "warning",
        message: `analysis ${id} sums to ${g.sumPct.toFixed()} mol %; normalised to 100`,
      });
  }
  return { gases, flags };
}

/** The composition a stream's quantity is read through. */
export function streamGas(s: PlantMonthStream, gases: Record<string, GasProperties>): GasProperties | null {
  if (s.analysis !== undefined) return gases[s.analysis] ?? null;
  switch (s.kind) {
    case "process-air":
      return DRY_AIR; // the format: dry air unless an analysis is given
    case "ammonia":
      return PURE_NH3;
    case "co2-export":
    case "co2-vent":
    case "stack-co2":
      return PURE_CO2;
    default:
      return null;
  }
}

const CARBON_T_PER_KMOL = new Dec("12.011").div(1000);

export function streamFlow(s: PlantMonthStream, gases: Record<string, GasProperties>): StreamFlow {
  const base: StreamFigures = {
    id: s.id,
    kind: s.kind,
    ...(s.destination ? { destination: s.destination } : {}),
    ...(s.fate ? { fate: s.fate } : {}),
    ...(s.analysis ? { analysis: s.analysis } : {}),
    unit: s.unit,
    quantity: s.quantity,
    uncertainty_pct: s.uncertainty_pct ?? null,
    ...(s.metered === false ? { metered: false as const } : {}),
    ...(s.systematic_pct !== undefined ? { systematic_pct: s.systematic_pct } : {}),
    ...(s.calibrated_on !== undefined ? { calibrated_on: s.calibrated_on } : {}),
    kmol: null,
    t: null,
    carbon_kmol: null,
    carbon_t: null,
    gj_lhv: null,
    gj_hhv: null,
    mwh: null,
    ...(s.factor_t_per_MWh ? { factor_t_per_MWh: s.factor_t_per_MWh } : {}),
    ...(s.factor_t_per_GJ ? { factor_t_per_GJ: s.factor_t_per_GJ } : {}),
  };
  const kind = UNIT_DEFS[s.unit].kind;
  if (s.kind === "electricity-import") return { stream: s, figures: { ...base, mwh: s.quantity }, gas: null, kmolPerUnit: null };
  if (s.kind === "steam-import" || s.kind === "steam-export")
    return { stream: s, figures: { ...base, gj_lhv: toGj(s.quantity, s.unit) }, gas: null, kmolPerUnit: null };
  if (kind === "electricity" || kind === "heat") throw new Error(`unit ${s.unit} on ${s.kind}`); // schema prevents this
  const gas = streamGas(s, gases);
  const kmolPerUnit = toKmol(ONE, s.unit, gas);
  const amounts = materialAmounts(s.quantity, s.unit, gas, kmolPerUnit);
  const g = gas!;
  const carbonKmol = g.atoms.C.isZero() ? null : amounts.kmol.times(g.atoms.C);
  const combustible = s.kind === "feed-gas" || s.kind === "fuel-gas" || s.kind === "purge-gas";
  return {
    stream: s,
    gas,
    kmolPerUnit,
    figures: {
      ...base,
      kmol: amounts.kmol,
      t: amounts.t,
      carbon_kmol: carbonKmol,
      carbon_t: carbonKmol ? carbonKmol.times(CARBON_T_PER_KMOL) : null,
      gj_lhv: combustible ? amounts.gjLhv : null,
      gj_hhv: combustible ? amounts.gjHhv : null,
    },
  };
}

export function streamFlows(doc: PlantMonth, gases: Record<string, GasProperties>): StreamFlow[] {
  return doc.streams.map((s) => streamFlow(s, gases));
}
