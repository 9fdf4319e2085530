import { D, K95, ZERO, dec, parseRatio, type Decimal } from "./decimal";
import type { ActivityBasis, FactorSet, FuelFactors } from "./factor-set-schema";
import type { EmissionsInput, Flag, StreamFigures } from "./types";
import { pushOnce } from "./model";

/** 1 MMBtu = 1.05505585262 GJ (International Table Btu, 1055.05585262 J). */
export const GJ_PER_MMBTU = new D("1.05505585262");
/** Molar masses used to turn kmol of carbon into CH4 mass (REFERENCE-VALUES, Calc). */
export const M_CH4 = new D("16.043");
export const M_CO2 = new D("44.009");

const VOLUME_MULTIPLES: Record<string, { base: "scf" | "Sm3" | "Nm3"; factor: string }> = {
  scf: { base: "scf", factor: "1" }, Mscf: { base: "scf", factor: "1e3" }, MMscf: { base: "scf", factor: "1e6" },
  Sm3: { base: "Sm3", factor: "1" }, kSm3: { base: "Sm3", factor: "1e3" }, MSm3: { base: "Sm3", factor: "1e6" },
  Nm3: { base: "Nm3", factor: "1" }, kNm3: { base: "Nm3", factor: "1e3" }, MNm3: { base: "Nm3", factor: "1e6" },
};

export function stoichiometricFactor(set: FactorSet): Decimal {
  return parseRatio(set.stoichiometric_factor.numerator, set.stoichiometric_factor.denominator);
}

/** Which fuel entry of the set describes a stream: site mapping by analysis first, then by kind. */
export function fuelFor(set: FactorSet, s: StreamFigures): { key: string; fuel: FuelFactors } {
  const mapped = s.analysis ? set.fuel_by_analysis?.[s.analysis] : undefined;
  const key = mapped ?? (s.kind === "purge-gas" && set.fuels["purge-gas"] ? "purge-gas" : "natural-gas");
  return { key, fuel: set.fuels[key] };
}

export function activityLabel(a: ActivityBasis): string {
  return a.kind === "energy" ? `${a.unit} ${a.basis}` : a.unit;
}

/**
 * A stream's activity in the unit the factor is expressed per. Calorific content comes from
 * lib/balance (from the analysis); a volume without it falls back to the set's default energy per
 * volume (e.g. Table C-1 HHV per scf), which is reported as an info flag because it is a lower tier.
 */
export function activityOf(s: StreamFigures, fuel: FuelFactors, flags: Flag[]): Decimal | null {
  const a = fuel.activity;
  if (a.kind === "mass") {
    if (s.t === null) return null;
    return a.unit === "t" ? dec(s.t) : dec(s.t).times(1000);
  }
  const gj = a.basis === "NCV" ? s.gj_lhv : s.gj_hhv;
  const energyGj: Decimal | null = gj === null ? null : dec(gj);
  if (energyGj === null && fuel.default_energy_per_volume) {
    const vol = VOLUME_MULTIPLES[s.unit];
    const dflt = fuel.default_energy_per_volume;
    if (vol && vol.base === dflt.volume_unit) {
      const inActivityUnits = dec(s.quantity).times(vol.factor).times(dflt.value);
      flags.push({ code: "default-energy-content", severity: "info",
        message: `Stream ${s.id}: energy taken from the default ${dflt.value} ${dflt.unit} (${dflt.source}) because no analysis gave it.` });
      return inActivityUnits;
    }
  }
  if (energyGj === null) return null;
  if (a.unit === "GJ") return energyGj;
  if (a.unit === "TJ") return energyGj.div(1000);
  return energyGj.div(GJ_PER_MMBTU);
}

/** Site-specific CO2 factor from the month's analysis, kg CO2 per activity unit, for display. */
export function siteFactorFromAnalysis(
  input: EmissionsInput, s: StreamFigures, fuel: FuelFactors, stoich: Decimal,
): Decimal | null {
  const an = s.analysis ? input.analyses[s.analysis] : undefined;
  const a = fuel.activity;
  if (!an) return null;
  const kgCo2PerKg = dec(an.carbon_mass_fraction).times(stoich);
  if (a.kind === "mass") return a.unit === "t" ? kgCo2PerKg.times(1000) : kgCo2PerKg;
  const mjPerKg = dec(a.basis === "NCV" ? an.ncv_mj_per_kg : an.gcv_mj_per_kg);
  if (mjPerKg.isZero()) return null;
  const kgPerGj = kgCo2PerKg.div(mjPerKg).times(1000);
  if (a.unit === "GJ") return kgPerGj;
  if (a.unit === "TJ") return kgPerGj.times(1000);
  return kgPerGj.times(GJ_PER_MMBTU);
}

/** Relative standard uncertainty (fraction) from an expanded 95 % percentage. */
/** Units in which a gas stream is metered as energy: no calorific value of an analysis stands between. */
const ENERGY_UNITS = new Set(["GJ-LHV", "GJ-HHV", "MMBtu-HHV"]);
export const meteredAsEnergy = (s: StreamFigures): boolean => ENERGY_UNITS.has(s.unit);

/**
 * The relative standard uncertainty of one property of the stream's analysis: as entered with the
 * analysis, else the set's default (flagged once, naming the analyses), else none.
 */
export function analysisStd(input: EmissionsInput, set: FactorSet, s: StreamFigures, property: "carbon" | "cv", flags: Flag[]):
  { analysis_key: string; analysis_rel_std: Decimal } | Record<string, never> {
  if (!s.analysis) return {};
  const a = input.analyses[s.analysis];
  const entered = property === "carbon" ? a?.carbon_uncertainty_pct : a?.cv_uncertainty_pct;
  const fallback = property === "carbon" ? set.analysis_uncertainty?.carbon : set.analysis_uncertainty?.calorific;
  const pct = entered ?? (fallback ? dec(fallback.value) : null);
  if (entered === undefined && fallback) {
    const what = property === "carbon" ? "carbon content" : "calorific value";
    pushOnce(flags, { code: "analysis-uncertainty-default", severity: "info",
      message: `Analysis ${s.analysis} states no uncertainty of its ${what}; ${fallback.value} % (95 %) is used (${fallback.source}).` });
  }
  const rel = relStd(pct, K95);
  return rel === null || rel.isZero() ? {} : { analysis_key: `${s.analysis}:${property}`, analysis_rel_std: rel };
}

const relStdCache = new Map<string, Decimal>();

/** Expanded % → relative standard uncertainty (÷ 100 ÷ k). Months repeat a handful of stated uncertainties, so each is divided once. */
export function relStd(expandedPct: Decimal | string | null | undefined, k: Decimal): Decimal | null {
  if (expandedPct === null || expandedPct === undefined) return null;
  const key = `${expandedPct.toString()}|${k.toString()}`;
  let rel = relStdCache.get(key);
  if (rel === undefined) {
    if (relStdCache.size > 10_000) relStdCache.clear();
    relStdCache.set(key, (rel = dec(expandedPct).div(100).div(k)));
  }
  return rel;
}

/** CO2 mass of an export/vent/stack stream: the measured tonnes, else kmol of CO2 × 44.009. */
export function co2MassOf(s: StreamFigures): Decimal {
  if (s.t !== null) return dec(s.t);
  if (s.carbon_kmol !== null) return dec(s.carbon_kmol).times(M_CO2).div(1000);
  if (s.unit === "t") return dec(s.quantity);
  if (s.unit === "kg") return dec(s.quantity).div(1000);
  return ZERO;
}

export function streamsOf(input: EmissionsInput, ...kinds: StreamFigures["kind"][]): StreamFigures[] {
  return input.streams.filter((s) => kinds.includes(s.kind));
}

/** Streams whose carbon crosses the site boundary inward: feed and fuel gas (purge is internal). */
export function carbonInputs(input: EmissionsInput): StreamFigures[] {
  return streamsOf(input, "feed-gas", "fuel-gas");
}

/**
 * CO2 of a feed or fuel stream's carbon. Where the set writes the feedstock equation by volume
 * (40 CFR 98.73(b)(1) Eq G-1) and the stream is feedstock with an analysis and a standard volume,
 * CO2 = 44/12 × Fdstk × CC × MW / MVC × 0.001 month by month; otherwise carbon × the set's
 * stoichiometric factor. The basis says which produced the figure.
 */
export function carbonCo2(input: EmissionsInput, set: FactorSet, s: StreamFigures, stoich: Decimal): { co2: Decimal; basis: string; equation: string | null } {
  const eq = set.feedstock_volume_equation;
  const a = s.analysis ? input.analyses[s.analysis] : undefined;
  if (eq && s.kind === "feed-gas" && s.standard_scf_68f !== undefined && a) {
    const scf = dec(s.standard_scf_68f);
    const co2 = dec(44).div(12).times(scf).times(dec(a.carbon_mass_fraction)).times(dec(a.molar_mass)).div(dec(eq.mvc_scf_per_kmol.value)).times("0.001");
    return {
      co2,
      equation: eq.equation,
      basis: `${eq.equation}: 44/12 × ${scf.toSignificantDigits(10).toString()} scf (${s.unit} restated to ${eq.standard_temperature_f} °F, ${eq.standard_pressure_psia} psia) × ${dec(a.carbon_mass_fraction).toSignificantDigits(6).toString()} kg C/kg × ${dec(a.molar_mass).toSignificantDigits(6).toString()} kg/kg-mol ÷ ${eq.mvc_scf_per_kmol.value} scf/kg-mol × 0.001`,
    };
  }
  return { co2: dec(s.carbon_t!).times(stoich), equation: null, basis: `carbon ${dec(s.carbon_t!).toSignificantDigits(10).toString()} t × ${set.stoichiometric_factor.numerator}/${set.stoichiometric_factor.denominator}` };
}
