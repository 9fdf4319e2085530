import { K95, ZERO, type Decimal } from "./decimal";
import { co2MassOf, relStd, streamsOf } from "./activity";
import type { FactorSet } from "./factor-set-schema";
import type { UncertaintyTerm } from "./model";
import type { Destination, EmissionsInput, Flag } from "./types";

export interface TransferRow { id: string; destination: Destination; co2_t: Decimal; deducted: boolean; rule_source: string }
export interface TransferSummary {
  rows: TransferRow[];
  by_destination: Record<Destination, { co2_t: Decimal; deducted: boolean; rule_source: string }>;
  transferred_t: Decimal;
  deductible_t: Decimal;
  /** Terms to add to the gross CO2 model to obtain the net: −export for each deducted export. */
  deduction_terms: UncertaintyTerm[];
}

const DESTINATIONS: Destination[] = ["urea", "storage", "pcc", "sale", "other"];

/** The set's rule for a destination; a set without a rule for "pcc" (an organisation's own) treats it as "other". */
function ruleFor(set: FactorSet, d: Destination) {
  return set.deduction_rules[d] ?? set.deduction_rules.other;
}

/**
 * CO2 leaving in co2-export streams is always shown; it is deducted from the direct total only
 * where the set's rule for its destination says so (IPCC: urea and storage; EU: storage only;
 * US: none). The measured tonnes are deducted as they are, because the rules deduct CO2 mass.
 */
export function transfers(input: EmissionsInput, set: FactorSet, flags: Flag[]): TransferSummary {
  const rows: TransferRow[] = [];
  const terms: UncertaintyTerm[] = [];
  for (const s of streamsOf(input, "co2-export")) {
    let destination: Destination = s.destination ?? "other";
    if (!s.destination) {
      flags.push({ code: "export-destination-missing", severity: "warning", message: `CO2 export ${s.id} has no destination; treated as "other".` });
    }
    if (!DESTINATIONS.includes(destination)) destination = "other";
    const rule = ruleFor(set, destination);
    const t = co2MassOf(s);
    rows.push({ id: s.id, destination, co2_t: t, deducted: rule.deducted, rule_source: rule.source });
    if (rule.deducted) terms.push({ value_t: t.neg(), stream_id: s.id, meter_rel_std: relStd(s.uncertainty_pct, K95) });
  }
  const by = {} as TransferSummary["by_destination"];
  for (const d of DESTINATIONS) {
    const rule = ruleFor(set, d);
    by[d] = { co2_t: rows.filter((r) => r.destination === d).reduce((a, r) => a.plus(r.co2_t), ZERO),
      deducted: rule.deducted, rule_source: rule.source };
  }
  return {
    rows, by_destination: by,
    transferred_t: rows.reduce((a, r) => a.plus(r.co2_t), ZERO),
    deductible_t: rows.filter((r) => r.deducted).reduce((a, r) => a.plus(r.co2_t), ZERO),
    deduction_terms: terms,
  };
}
