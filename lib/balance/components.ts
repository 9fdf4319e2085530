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

export interface ComponentData {
  atoms: { C: number; H: number; N: number; O: number; Ar: number; He: number };
  /** Ideal molar gross calorific value at 15 °C combustion reference, kJ/mol (= MJ/kmol). */
  gross15: Dec;
  /** Ideal-gas Cp near 25 °C, J/(mol K); used only to move gross CV from 15 °C to 0 °C and 60 °F. */
  cp: Dec;
  /** ISO 6976:2016 summation factors at 0 °C and 15 °C metering reference, 101.325 kPa. */
  s0: Dec;
  s15: Dec;
  source: string;
}

const a = (C: number, H: number, N = 0, O = 0, Ar = 0, He = 0) => ({ C, H, N, O, Ar, He });
const row = (atoms: ComponentData["atoms"], gross15: string, cp: string, s0: string, s15: string, source: string) =>
  ({ atoms, gross15: dec(gross15), cp: dec(cp), s0: dec(s0), s15: dec(s15), source }) satisfies ComponentData;

// gross15: ISO 6976:2016 Table 3. Methane 891.51 is C* (REFERENCE-VALUES); the others are
// from memory. s15: C* for CH4 C2H6 C3H8 N2 CO2 (REFERENCE-VALUES); all s0 and the other
// s15 values are from memory (their effect on Z is below 0.01 % for pipeline gas).
// cp: NIST WebBook ideal-gas values near 298 K, from memory (the 15→0 °C shift they drive
// is ~1.4 kJ/mol for methane, so a 3 % Cp error moves gross CV by < 0.005 %).
export const COMPONENT_DATA: Record<Component, ComponentData> = {
  CH4: row(a(1, 4), "891.51", "35.69", "0.04886", "0.04452", "gross C*; s15 C*; s0 from memory"),
  C2H6: row(a(2, 6), "1562.14", "52.49", "0.1010", "0.0919", "gross from memory; s15 C*"),
  C3H8: row(a(3, 8), "2221.10", "73.60", "0.1478", "0.1344", "gross from memory; s15 C*"),
  iC4H10: row(a(4, 10), "2870.58", "96.82", "0.1930", "0.1753", "from memory"),
  nC4H10: row(a(4, 10), "2879.76", "98.49", "0.2025", "0.1840", "from memory"),
  iC5H12: row(a(5, 12), "3531.68", "118.87", "0.2410", "0.2191", "from memory"),
  nC5H12: row(a(5, 12), "3538.60", "120.04", "0.2600", "0.2361", "from memory"),
  nC6H14: row(a(6, 14), "4198.24", "143.09", "0.3180", "0.2890", "from memory"),
  N2: row(a(0, 0, 2), "0", "29.12", "0.0212", "0.0170", "inert; s15 C*"),
  CO2: row(a(1, 0, 0, 2), "0", "37.12", "0.0820", "0.0752", "inert; s15 C*"),
  H2: row(a(0, 2), "286.15", "28.84", "-0.0040", "-0.0048", "from memory (negative s as in ISO 6976)"),
  O2: row(a(0, 0, 0, 2), "0", "29.38", "0.0316", "0.0283", "from memory"),
  Ar: row(a(0, 0, 0, 0, 1), "0", "20.79", "0.0307", "0.0276", "from memory"),
  He: row(a(0, 0, 0, 0, 0, 1), "0", "20.79", "0", "0", "from memory (taken as 0)"),
  // Analyses are dry by the format, so water vapour is treated as non-combustible here.
  H2O: row(a(0, 2, 0, 1), "0", "33.58", "0.3081", "0.2560", "from memory"),
  CO: row(a(1, 0, 0, 1), "282.91", "29.14", "0.0224", "0.0200", "from memory"),
  NH3: row(a(0, 3, 1), "383.51", "35.06", "0.1100", "0.1000", "from memory"),
};

/** Heat capacities of combustion products and oxygen, J/(mol K), NIST WebBook near 298 K, from memory. */
export const CP_PRODUCTS = {
  CO2: dec("37.12"),
  H2O_liquid: dec("75.33"),
  O2: dec("29.38"),
  N2: dec("29.12"),
};

/**
 * Enthalpy of vaporisation of water at 15 °C, kJ/mol: (891.51 − 802.69) / 2 from the ISO
 * 6976:2016 methane row (Calc). Net = gross − (H atoms / 2) × L, as ISO 6976 defines it.
 * L moves with temperature by Cp(liquid) − Cp(gas) = 75.33 − 33.58 J/(mol K).
 */
export const WATER_L15 = dec("44.41");
export const WATER_DCP = dec("41.75");

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
