// Units of the plant-month format and their conversion to kmol, tonnes and GJ. Gas volumes
// go through the stream's own real-gas molar volume at the unit's reference; energies through
// the stream's own molar calorific value. A unit that needs a composition and has none is an error.
import { Dec, dec } from "./decimal";
import { CUBIC_FOOT_M3, type GasProperties, type Reference, calorificValues, realMolarVolume } from "./gas-properties";

export const UNITS = [
  "Sm3", "kSm3", "MSm3", "Nm3", "kNm3", "MNm3", "scf", "Mscf", "MMscf",
  "t", "kg", "GJ-LHV", "GJ-HHV", "MMBtu-HHV", "MWh", "GJ",
] as const;
export type Unit = (typeof UNITS)[number];

/** International Table Btu = 1055.05585262 J (exact), so 1 MMBtu = 1.05505585262 GJ. */
export const MMBTU_GJ = dec("1.05505585262");
/** 1 MWh = 3.6 GJ (exact). */
export const MWH_GJ = dec("3.6");
/** × 0.001 is ÷ 1000 exactly (both round the same exact value), without a long division. */
const MILLI = dec("0.001");

export type UnitDef =
  | { kind: "volume"; reference: Reference; m3: Dec }
  | { kind: "mass"; t: Dec }
  | { kind: "energy"; basis: "net" | "gross"; gj: Dec; combustion: Reference }
  | { kind: "electricity" }
  | { kind: "heat"; gj: Dec };

const vol = (reference: Reference, m3: Dec): UnitDef => ({ kind: "volume", reference, m3 });

export const UNIT_DEFS: Record<Unit, UnitDef> = {
  Sm3: vol("15C", dec(1)),
  kSm3: vol("15C", dec(1000)),
  MSm3: vol("15C", dec(1e6)),
  Nm3: vol("0C", dec(1)),
  kNm3: vol("0C", dec(1000)),
  MNm3: vol("0C", dec(1e6)),
  scf: vol("60F", CUBIC_FOOT_M3),
  Mscf: vol("60F", CUBIC_FOOT_M3.times(1000)),
  MMscf: vol("60F", CUBIC_FOOT_M3.times(1e6)),
  t: { kind: "mass", t: dec(1) },
  kg: { kind: "mass", t: dec("0.001") },
  // Energy in GJ is read on the 15 °C combustion reference (ISO 6976 / European practice);
  // MMBtu-HHV on 60 °F (US practice).
  "GJ-LHV": { kind: "energy", basis: "net", gj: dec(1), combustion: "15C" },
  "GJ-HHV": { kind: "energy", basis: "gross", gj: dec(1), combustion: "15C" },
  "MMBtu-HHV": { kind: "energy", basis: "gross", gj: MMBTU_GJ, combustion: "60F" },
  MWh: { kind: "electricity" },
  GJ: { kind: "heat", gj: dec(1) },
};

export class UnitError extends Error {}

export interface MaterialAmounts {
  kmol: Dec;
  t: Dec;
  gjLhv: Dec; // net, 15 °C combustion reference
  gjHhv: Dec; // gross, 15 °C combustion reference
}

/** kmol of a material stream written in `unit`; `gas` is the stream's composition (or the pure substance). */
export function toKmol(quantity: Dec, unit: Unit, gas: GasProperties | null): Dec {
  const def = UNIT_DEFS[unit];
  if (def.kind === "electricity" || def.kind === "heat") throw new UnitError(`${unit} is not an amount of material`);
  if (!gas) throw new UnitError(`${unit} needs a gas composition to become kmol`);
  if (def.kind === "volume") return quantity.times(def.m3).div(realMolarVolume(gas, def.reference));
  if (def.kind === "mass") {
    if (gas.molarMass.isZero()) throw new UnitError("composition has no molar mass");
    return quantity.times(def.t).times(1000).div(gas.molarMass);
  }
  const cv = calorificValues(gas, "15C", def.combustion);
  const perKmol = def.basis === "net" ? cv.netMolar : cv.grossMolar; // MJ/kmol
  if (perKmol.isZero()) throw new UnitError(`${unit} needs a combustible composition`);
  return quantity.times(def.gj).times(1000).div(perKmol);
}

/** Inverse of toKmol: the quantity in `unit` for an amount in kmol. */
export function fromKmol(kmol: Dec, unit: Unit, gas: GasProperties): Dec {
  return kmol.div(toKmol(dec(1), unit, gas));
}

export function materialAmounts(quantity: Dec, unit: Unit, gas: GasProperties | null, kmolPerUnit?: Dec): MaterialAmounts {
  // With the stream's kmol per unit already known, its amount is one product, not another division.
  const kmol = kmolPerUnit ? quantity.times(kmolPerUnit) : toKmol(quantity, unit, gas);
  const cv = calorificValues(gas!, "15C", "15C");
  return {
    kmol,
    t: kmol.times(gas!.molarMass).times(MILLI),
    gjLhv: kmol.times(cv.netMolar).times(MILLI),
    gjHhv: kmol.times(cv.grossMolar).times(MILLI),
  };
}

/** Heat of a steam stream in GJ (GJ as given, MWh × 3.6). */
export function toGj(quantity: Dec, unit: Unit): Dec {
  const def = UNIT_DEFS[unit];
  if (def.kind === "heat") return quantity.times(def.gj);
  if (def.kind === "electricity") return quantity.times(MWH_GJ);
  throw new UnitError(`${unit} is not a heat unit`);
}
