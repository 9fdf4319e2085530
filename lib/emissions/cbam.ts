// CBAM embedded emissions of the ammonia a site produced over a period (issue 14). Pure Decimal.
//
// Texts read: Reg. (EU) 2023/956 Annex IV section 1 (definitions: specific embedded emissions are
// t CO2e per tonne of goods; the emission factor for electricity) and section 2 (for simple goods,
// direct and, where applicable, indirect emissions are accounted for; SEE = attributed emissions ÷
// activity level) — read in a reproduction of the Annex IV text; the equation itself is an image
// there and was not read. Not confirmed here: the CN code of anhydrous ammonia in Annex I, that
// Annex II leaves fertilisers' indirect emissions counted (a secondary summary says so), and the
// definitive period's implementing rules. Each is marked unconfirmed where it is used.
//
// Direct emissions attributed to the ammonia: the installation's CO2e before deductions, less only
// what the EU monitoring rules deduct (CO2 to geological storage and CO2 bound in precipitated
// calcium carbonate, Reg. (EU) 2018/2066 Art 49); CO2 sent to urea counts as emitted, as it does in
// the EU ammonia benchmark (Decision 2011/278/EU recital, read in a parallel-text excerpt). Heat
// and waste gases crossing the boundary are not attributed (no such streams in the format).
import { ZERO, dec, type Decimal } from "./decimal";
import type { YearMonthEntry } from "./year";

export const CBAM_GOOD = {
  cn_code: "2814 10 00",
  description: "Anhydrous ammonia",
  cn_status: "unconfirmed" as const,
  cn_source: "Reg. (EU) 2023/956 Annex I (fertilisers); the code was not read in the Annex itself",
  route: "Steam reforming of natural gas and ammonia synthesis",
};

export const CBAM_RULES = [
  { text: "Reg. (EU) 2023/956 Annex IV section 2: specific embedded emissions of simple goods, direct and, where applicable, indirect emissions, per tonne of goods produced in the period", status: "confirmed" as const, checked: "Annex IV text in a reproduction of the Regulation (the equation image not read)" },
  { text: "Direct emissions: the installation's CO2e before deductions, less CO2 to storage and CO2 in precipitated calcium carbonate only (Reg. (EU) 2018/2066 Art 49); CO2 to urea counted as emitted", status: "confirmed" as const, checked: "Art 49 in a consolidated text of 2018/2066; the urea rule in Decision 2011/278/EU's recital (parallel-text excerpt)" },
  { text: "Indirect emissions: electricity consumed (MWh) × the emission factor of its source, per tonne", status: "confirmed" as const, checked: "Reg. (EU) 2023/956 Annex IV section 1(e) definition, in the same reproduction" },
  { text: "Fertilisers count their indirect emissions in the definitive period (Annex II of 2023/956 lists the goods that count direct emissions only)", status: "unconfirmed" as const, checked: "a secondary summary; Annex II not read" },
];

export interface CbamFigures {
  period: { from: string; to: string; months: string[] };
  production_t: Decimal;
  direct_t: Decimal;
  /** What was subtracted from the CO2e before deductions, t (storage and pcc). */
  direct_deducted_t: Decimal;
  /** CO2 sent to urea, counted in direct_t, t. */
  urea_co2_t: Decimal;
  electricity_mwh: Decimal;
  /** Electricity whose factor is known (entered per stream), MWh; the rest is not counted. */
  electricity_mwh_with_factor: Decimal;
  indirect_t: Decimal;
  indirect_complete: boolean;
  /** Factor used, t CO2/MWh, when every month used one and the same figure; otherwise null. */
  electricity_factor_t_per_mwh: Decimal | null;
  see_direct_t_per_t: Decimal | null;
  see_indirect_t_per_t: Decimal | null;
  see_total_t_per_t: Decimal | null;
  /** Hydrogen or other precursors bought in: the plant-month format has no stream for them. */
  precursors: [];
}

/** Embedded emissions over the months given (any months of one site; a calendar year by default). */
export function embeddedEmissions(months: YearMonthEntry[]): CbamFigures {
  const sorted = [...months].sort((a, b) => a.month.localeCompare(b.month));
  let production = ZERO;
  let gross = ZERO;
  let deducted = ZERO;
  let urea = ZERO;
  let mwh = ZERO;
  let mwhKnown = ZERO;
  let indirect = ZERO;
  const factors = new Set<string>();
  for (const m of sorted) {
    production = production.plus(dec(m.input.ammonia_t));
    gross = gross.plus(m.result.emissions.co2e_t);
    const by = m.result.transfers.by_destination;
    deducted = deducted.plus(by.storage?.co2_t ?? ZERO).plus(by.pcc?.co2_t ?? ZERO);
    urea = urea.plus(by.urea?.co2_t ?? ZERO);
    for (const s of m.input.streams) {
      if (s.kind !== "electricity-import" || s.mwh === null) continue;
      const q = dec(s.mwh);
      mwh = mwh.plus(q);
      if (s.factor_t_per_MWh !== undefined) {
        mwhKnown = mwhKnown.plus(q);
        indirect = indirect.plus(q.times(dec(s.factor_t_per_MWh)));
        factors.add(dec(s.factor_t_per_MWh).toString());
      }
    }
  }
  const direct = gross.minus(deducted);
  const per = (x: Decimal) => (production.gt(0) ? x.div(production) : null);
  const complete = mwhKnown.eq(mwh);
  const seeDirect = per(direct);
  const seeIndirect = complete ? per(indirect) : null;
  return {
    period: { from: sorted[0]?.month ?? "", to: sorted[sorted.length - 1]?.month ?? "", months: sorted.map((m) => m.month) },
    production_t: production,
    direct_t: direct,
    direct_deducted_t: deducted,
    urea_co2_t: urea,
    electricity_mwh: mwh,
    electricity_mwh_with_factor: mwhKnown,
    indirect_t: indirect,
    indirect_complete: complete,
    electricity_factor_t_per_mwh: factors.size === 1 ? dec([...factors][0]) : null,
    see_direct_t_per_t: seeDirect,
    see_indirect_t_per_t: seeIndirect,
    see_total_t_per_t: seeDirect && seeIndirect ? seeDirect.plus(seeIndirect) : null,
    precursors: [],
  };
}
