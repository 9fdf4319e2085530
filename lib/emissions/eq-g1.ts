import type DecimalBase from "decimal.js";
import { dec, type Decimal } from "./decimal";

/**
 * 40 CFR 98.73(b)(1) Eq G-1, one feedstock for one month:
 *   CO2 (t) = 44/12 × Fdstk (scf) × CC (kg C/kg) × MW (kg/kmol) / MVC (scf/kmol) × 0.001
 * MVC is 849.5 scf/kg-mol at 68 °F and 14.7 psia, so Fdstk must be scf at 68 °F; a volume metered
 * at 60 °F (836.6 scf/kmol) needs converting first, or CO2 comes out about 1.5 % low.
 */
export function eqG1FeedstockCo2T(scf: DecimalBase.Value, carbonMassFraction: DecimalBase.Value, molarMass: DecimalBase.Value,
  mvcScfPerKmol: DecimalBase.Value = "849.5"): Decimal {
  return dec(44).div(12).times(dec(scf)).times(dec(carbonMassFraction)).times(dec(molarMass)).div(dec(mvcScfPerKmol)).times("0.001");
}
