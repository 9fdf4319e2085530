// Component data for gas properties. Every value carries its source; "from memory" marks
// values not read in the primary document (see shared/product/REFERENCE-VALUES.md).
import { Dec, dec } from "./decimal";

export const COMPONENTS = [
  "CH4", "C2H6", "C3H8", "iC4H10", "nC4H10", "iC5H12", "nC5H12", "nC6H14",
  "N2", "CO2", "H2", "O2", "Ar", "He", "H2O", "CO", "NH3",
] as const;
export type Component = (typeof COMPONENTS)[number];

/** CIAAW 2021 conventional (abridged) standard atomic weights, g/mol. */
export const ATOMIC_WEIGHT = {
  H: dec("1.008"),
  C: dec("12.011"),
  N: dec("14.007"),
  O: dec("15.999"),
  Ar: dec("39.95"),
  He: dec("4.0026"),
} as const;

/** The four reference temperatures the engine works at: 0 °C, 15 °C, 60 °F (15.55 °C in the tables) and 68 °F (20 °C). */
export type TableTemperature = "0C" | "15C" | "60F" | "68F";
type AtRefs = Record<TableTemperature, Dec>;

export interface ComponentData {
  atoms: { C: number; H: number; N: number; O: number; Ar: number; He: number };
  /** Ideal molar gross (superior) calorific value at each combustion reference, kJ/mol (= MJ/kmol). */
  gross: AtRefs;
  /** Summation factor s at each metering reference, 101.325 kPa (Z = 1 − (Σ xᵢ sᵢ)²). */
  s: AtRefs;
  source: string;
}

const a = (C: number, H: number, N = 0, O = 0, Ar = 0, He = 0) => ({ C, H, N, O, Ar, He });
const at = (v: [string, string, string, string]): AtRefs => ({ "0C": dec(v[0]), "15C": dec(v[1]), "60F": dec(v[2]), "68F": dec(v[3]) });
const ZERO4: [string, string, string, string] = ["0", "0", "0", "0"];
const row = (atoms: ComponentData["atoms"], gross: [string, string, string, string], s: [string, string, string, string]) =>
  ({ atoms, gross: at(gross), s: at(s), source: TABLES }) satisfies ComponentData;

/**
 * ISO 6976:2016 Table A.3 (summation factors at 0, 15, 15.55 and 20 °C) and Table A.4 (ideal
 * gross calorific values at the same temperatures), as reproduced in an open clean-room
 * implementation of the standard checked against its Annex D examples (RuedigerForster/ISO_6976,
 * src/iso6976.cpp, read 2026-12). The standard's own text was not read: unconfirmed. 60 °F (15.56 °C) takes the 15.55 °C column; 68 °F is 20 °C.
 */
export const TABLES = "ISO 6976:2016 Tables A.3 and A.4, as reproduced in an open implementation (unconfirmed)";

export const COMPONENT_DATA: Record<Component, ComponentData> = {
  CH4: row(a(1, 4), ["892.92", "891.51", "891.46", "891.05"], ["0.04886", "0.04452", "0.04437", "0.04317"]),
  C2H6: row(a(2, 6), ["1564.35", "1562.14", "1562.06", "1561.42"], ["0.0997", "0.0919", "0.0916", "0.0895"]),
  C3H8: row(a(3, 8), ["2224.03", "2221.10", "2220.99", "2220.13"], ["0.1465", "0.1344", "0.1340", "0.1308"]),
  iC4H10: row(a(4, 10), ["2874.21", "2870.58", "2870.45", "2869.39"], ["0.1885", "0.1722", "0.1717", "0.1673"]),
  nC4H10: row(a(4, 10), ["2883.35", "2879.76", "2879.63", "2878.58"], ["0.2022", "0.1840", "0.1834", "0.1785"]),
  iC5H12: row(a(5, 12), ["3536.01", "3531.68", "3531.52", "3530.25"], ["0.2458", "0.2251", "0.2244", "0.2189"]),
  nC5H12: row(a(5, 12), ["3542.91", "3538.60", "3538.45", "3537.19"], ["0.2586", "0.2361", "0.2354", "0.2295"]),
  nC6H14: row(a(6, 14), ["4203.24", "4198.24", "4198.06", "4196.60"], ["0.3319", "0.3001", "0.2990", "0.2907"]),
  N2: row(a(0, 0, 2), ZERO4, ["0.0214", "0.0170", "0.0169", "0.0156"]),
  CO2: row(a(1, 0, 0, 2), ZERO4, ["0.0821", "0.0752", "0.0749", "0.0730"]),
  H2: row(a(0, 2), ["286.64", "286.15", "286.13", "285.99"], ["-0.01", "-0.01", "-0.01", "-0.01"]),
  O2: row(a(0, 0, 0, 2), ZERO4, ["0.0311", "0.0276", "0.0275", "0.0265"]),
  Ar: row(a(0, 0, 0, 0, 1), ZERO4, ["0.0307", "0.0273", "0.0272", "0.0262"]),
  He: row(a(0, 0, 0, 0, 0, 1), ZERO4, ["-0.01", "-0.01", "-0.01", "-0.01"]),
  // Analyses are dry by the format, so water vapour is treated as non-combustible here.
  H2O: row(a(0, 2, 0, 1), ZERO4, ["0.3093", "0.2562", "0.2546", "0.2419"]),
  CO: row(a(1, 0, 0, 1), ["282.80", "282.91", "282.91", "282.95"], ["0.0258", "0.0217", "0.0215", "0.0203"]),
  NH3: row(a(0, 3, 1), ["384.57", "383.51", "383.47", "383.16"], ["0.1230", "0.1100", "0.1096", "0.1062"]),
};

/**
 * Standard enthalpy of vaporisation of water L0(t), kJ/mol (the water row of Table A.4, same
 * reproduction). Net = gross − (H atoms / 2) × L0, as
 * ISO 6976 defines it.
 */
export const WATER_L0: AtRefs = at(["45.064", "44.431", "44.408", "44.222"]);

function workMolarMass(c: Component): Dec {
  const { atoms } = COMPONENT_DATA[c];
  const w = ATOMIC_WEIGHT;
  return w.C.times(atoms.C)
    .plus(w.H.times(atoms.H))
    .plus(w.N.times(atoms.N))
    .plus(w.O.times(atoms.O))
    .plus(w.Ar.times(atoms.Ar))
    .plus(w.He.times(atoms.He));
}

// Per-component constants, worked out once (they depend on nothing but the tables above).
const MOLAR_MASS = new Map<Component, Dec>();
const H2_EQUIVALENTS = new Map<Component, Dec>();

export function molarMassOf(c: Component): Dec {
  let m = MOLAR_MASS.get(c);
  if (m === undefined) MOLAR_MASS.set(c, (m = workMolarMass(c)));
  return m;
}

/** Hydrogen equivalents per mole: 2C + H/2 − O (CcHh: 2c + h/2; H2 1; CO 1; CO2 0; O2 −2). */
export function h2EquivalentsOf(c: Component): Dec {
  let h = H2_EQUIVALENTS.get(c);
  if (h === undefined) {
    const { C, H, O } = COMPONENT_DATA[c].atoms;
    H2_EQUIVALENTS.set(c, (h = new Dec(2 * C).plus(new Dec(H).div(2)).minus(O)));
  }
  return h;
}

export const DRY_AIR_PCT: Partial<Record<Component, string>> = {
  // N2, O2, Ar: US Standard Atmosphere 1976 (78.084, 20.9476 → 20.948, 0.934); CO2 0.034 as
  // the product brief fixes it (older tables give 0.0314, today's air is ~0.042). Sums to 100.
  N2: "78.084",
  O2: "20.948",
  Ar: "0.934",
  CO2: "0.034",
};
