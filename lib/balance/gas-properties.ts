// Gas properties from a composition, ISO 6976:2016 method: ideal molar calorific values
// summed over components, compressibility Z = 1 − (Σ xᵢ sᵢ)², real volumetric values =
// ideal molar value / (Z·R·T/p). All in Decimal.
import {
  COMPONENTS, COMPONENT_DATA, WATER_L0,
  type Component, h2EquivalentsOf, molarMassOf, ATOMIC_WEIGHT,
} from "./components";
import { Dec, ONE, ZERO, HUNDRED, dec, sum } from "./decimal";

export type Reference = "15C" | "0C" | "60F" | "68F";
export type Composition = Partial<Record<Component, Dec>>;

/** Molar gas constant, J/(mol K): CODATA 2018, exact since the 2019 SI. */
export const R = dec("8.314462618");
/** 1 psi in Pa: 0.45359237 kg × 9.80665 m/s² / (0.0254 m)², exact by definition. */
export const PSI_PA = dec("0.45359237").times("9.80665").div(dec("0.0254").pow(2));
/** 1 ft³ in m³, exact by definition (0.3048 m)³. */
export const CUBIC_FOOT_M3 = dec("0.3048").pow(3);

const fahrenheitToC = (f: string) => dec(f).minus(32).times(5).div(9);

/** Metering/combustion references: Sm3 15 °C, Nm3 0 °C (101.325 kPa); scf 60 °F, 14.696 psia. 68 °F is 40 CFR 98 Subpart G's. */
export const REFERENCES: Record<Reference, { tC: Dec; T: Dec; p: Dec }> = {
  "15C": { tC: dec("15"), T: dec("288.15"), p: dec("101325") },
  "0C": { tC: dec("0"), T: dec("273.15"), p: dec("101325") },
  "60F": { tC: fahrenheitToC("60"), T: fahrenheitToC("60").plus("273.15"), p: dec("14.696").times(PSI_PA) },
  "68F": { tC: fahrenheitToC("68"), T: fahrenheitToC("68").plus("273.15"), p: dec("14.696").times(PSI_PA) },
};

export interface GasProperties {
  /** Mole fractions (0..1) after normalisation; only components present. */
  fractions: Composition;
  /** Sum of the analysis as given, mol %. */
  sumPct: Dec;
  /** True when the sum was not exactly 100 and the fractions were rescaled. */
  normalised: boolean;
  molarMass: Dec; // kg/kmol
  atoms: { C: Dec; H: Dec; N: Dec; O: Dec }; // per mole of gas
  h2EquivalentsPerMol: Dec; // 2C + H/2 − O per mole
  n2PerMol: Dec; // N atoms / 2 per mole
  carbonMassFraction: Dec; // kg C / kg gas
}

export class CompositionError extends Error {
  constructor(readonly sumPct: Dec) {
    super(`composition sums to ${sumPct.toFixed()} %, more than 0.5 from 100`);
  }
}

/** Sum tolerance of an analysis, mol % (plant-month format). */
export const SUM_TOLERANCE_PCT = dec("0.5");
const HUNDREDTH = dec("0.01");

export function gasProperties(pct: Composition): GasProperties {
  const entries = COMPONENTS.filter((c) => pct[c] !== undefined && !pct[c]!.isZero());
  const sumPct = sum(entries.map((c) => pct[c]!));
  if (sumPct.minus(HUNDRED).abs().gt(SUM_TOLERANCE_PCT)) throw new CompositionError(sumPct);
  const fractions: Composition = {};
  // A composition summing to exactly 100 is scaled by 0.01 (the same exact value as ÷ 100, no long division).
  const exact = sumPct.eq(HUNDRED);
  for (const c of entries) fractions[c] = exact ? pct[c]!.times(HUNDREDTH) : pct[c]!.div(sumPct);
  const over = (f: (c: Component) => Dec) => sum(entries.map((c) => fractions[c]!.times(f(c))));
  // Atom counts are small integers; a component without the atom adds nothing, so it is skipped.
  const count = (atom: "C" | "H" | "N" | "O") =>
    sum(entries.filter((c) => COMPONENT_DATA[c].atoms[atom] !== 0).map((c) => fractions[c]!.times(COMPONENT_DATA[c].atoms[atom])));
  const atoms = { C: count("C"), H: count("H"), N: count("N"), O: count("O") };
  const molarMass = over(molarMassOf);
  return {
    fractions,
    sumPct,
    normalised: !sumPct.eq(HUNDRED),
    molarMass,
    atoms,
    h2EquivalentsPerMol: over(h2EquivalentsOf),
    n2PerMol: atoms.N.div(2),
    carbonMassFraction: molarMass.isZero() ? ZERO : atoms.C.times(ATOMIC_WEIGHT.C).div(molarMass),
  };
}

// Speed: the per-component values below depend only on the component and the reference, and
// the per-gas values only on an analysis, which is never changed once computed. Both are kept
// the first time they are worked out (the same Decimal either way, so no figure moves).
const perComponent = new Map<string, Dec>();
function memo(kind: string, c: Component, ref: Reference, work: () => Dec): Dec {
  const key = `${kind}|${c}|${ref}`;
  let v = perComponent.get(key);
  if (v === undefined) perComponent.set(key, (v = work()));
  return v;
}
const perGas = new WeakMap<GasProperties, Map<string, unknown>>();
function memoGas<T>(gas: GasProperties, key: string, work: () => T): T {
  let m = perGas.get(gas);
  if (!m) perGas.set(gas, (m = new Map()));
  if (!m.has(key)) m.set(key, work());
  return m.get(key) as T;
}

/** Summation factor at a metering reference: the ISO 6976:2016 Table A.3 column for it (60 °F takes 15.55 °C, 68 °F takes 20 °C). */
export function summationFactor(c: Component, ref: Reference): Dec {
  return COMPONENT_DATA[c].s[ref];
}

export function compressibility(gas: GasProperties, ref: Reference): Dec {
  return memoGas(gas, `z|${ref}`, () => {
    const s = sum(Object.entries(gas.fractions).map(([c, x]) => x.times(summationFactor(c as Component, ref))));
    return ONE.minus(s.pow(2));
  });
}

const idealVolumes = new Map<Reference, Dec>();
/** Ideal molar volume R·T/p, m³/kmol. */
export function idealMolarVolume(ref: Reference): Dec {
  let v = idealVolumes.get(ref);
  if (v === undefined) {
    const { T, p } = REFERENCES[ref];
    idealVolumes.set(ref, (v = R.times(T).div(p).times(1000)));
  }
  return v;
}

/** Real-gas molar volume Z·R·T/p, m³/kmol. */
export function realMolarVolume(gas: GasProperties, ref: Reference): Dec {
  return compressibility(gas, ref).times(idealMolarVolume(ref));
}

/** Component ideal molar gross CV at a combustion reference, kJ/mol (ISO 6976:2016 Table A.4). */
export function componentGross(c: Component, ref: Reference): Dec {
  return COMPONENT_DATA[c].gross[ref];
}

/** Component ideal molar net CV: gross − (H/2)·L(t), kJ/mol. */
export function componentNet(c: Component, ref: Reference): Dec {
  return memo("net", c, ref, () => workComponentNet(c, ref));
}
function workComponentNet(c: Component, ref: Reference): Dec {
  const gross = componentGross(c, ref);
  if (gross.isZero()) return ZERO;
  const L = WATER_L0[ref];
  return gross.minus(L.times(COMPONENT_DATA[c].atoms.H).div(2));
}

export interface CalorificValues {
  grossMolar: Dec; // MJ/kmol (= kJ/mol), ideal
  netMolar: Dec;
  z: Dec;
  molarVolume: Dec; // real, m³/kmol at the metering reference
  grossVolumeIdeal: Dec; // MJ/m³
  netVolumeIdeal: Dec;
  grossVolumeReal: Dec;
  netVolumeReal: Dec;
  grossMass: Dec; // MJ/kg
  netMass: Dec;
}

/** Calorific values with a combustion reference and a metering reference (e.g. 15/15, 25/0). */
export function calorificValues(gas: GasProperties, metering: Reference, combustion: Reference = metering): CalorificValues {
  return memoGas(gas, `cv|${metering}|${combustion}`, () => workCalorificValues(gas, metering, combustion));
}
function workCalorificValues(gas: GasProperties, metering: Reference, combustion: Reference): CalorificValues {
  // The molar sums depend on the combustion reference only; the quotients are asked for one or two
  // at a time, so each is divided when first read and kept (getters, enumerable like fields).
  const { grossMolar, netMolar } = molarCalorificValues(gas, combustion);
  const z = compressibility(gas, metering);
  const vIdeal = idealMolarVolume(metering);
  const vReal = vIdeal.times(z);
  const M = gas.molarMass;
  const once = (f: () => Dec) => {
    let v: Dec | undefined;
    return () => (v ??= f());
  };
  const gvi = once(() => grossMolar.div(vIdeal));
  const nvi = once(() => netMolar.div(vIdeal));
  const gvr = once(() => grossMolar.div(vReal));
  const nvr = once(() => netMolar.div(vReal));
  const gm = once(() => (M.isZero() ? ZERO : grossMolar.div(M)));
  const nm = once(() => (M.isZero() ? ZERO : netMolar.div(M)));
  return {
    grossMolar,
    netMolar,
    z,
    molarVolume: vReal,
    get grossVolumeIdeal() { return gvi(); },
    get netVolumeIdeal() { return nvi(); },
    get grossVolumeReal() { return gvr(); },
    get netVolumeReal() { return nvr(); },
    get grossMass() { return gm(); },
    get netMass() { return nm(); },
  };
}

/** Ideal molar gross and net CV of the mixture at a combustion reference, MJ/kmol. */
function molarCalorificValues(gas: GasProperties, combustion: Reference): { grossMolar: Dec; netMolar: Dec } {
  return memoGas(gas, `molar|${combustion}`, () => {
    let grossMolar = ZERO;
    let netMolar = ZERO;
    for (const [c, x] of Object.entries(gas.fractions)) {
      grossMolar = grossMolar.plus(x.times(componentGross(c as Component, combustion)));
      netMolar = netMolar.plus(x.times(componentNet(c as Component, combustion)));
    }
    return { grossMolar, netMolar };
  });
}

/** Composition (mol %) read from decimal strings, e.g. for constants. */
export function compositionOf(pct: Partial<Record<Component, string>>): Composition {
  const out: Composition = {};
  for (const [c, v] of Object.entries(pct)) out[c as Component] = dec(v as string);
  return out;
}
