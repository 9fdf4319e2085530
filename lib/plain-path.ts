/**
 * Where a problem is, in the words of the pages. Validation and the engine name places by their
 * JSON path (`streams[2].quantity`, `analyses.estuary-grid-gas.components`, `balances.carbon`),
 * which the API keeps for programs; people read "Stream fuel: quantity".
 */
const FIELD_WORDS: Record<string, string> = {
  quantity: "quantity",
  unit: "unit",
  kind: "kind",
  id: "stream id",
  analysis: "analysis",
  fate: "fate",
  destination: "destination",
  uncertainty_pct: "uncertainty",
  factor_t_per_MWh: "electricity factor",
  factor_t_per_GJ: "steam factor",
  meter: "meter tag",
  note: "note",
  components: "components",
  sampledOn: "sampling date",
  laboratory: "laboratory",
  carbonUncertaintyPct: "carbon content uncertainty",
  cvUncertaintyPct: "calorific value uncertainty",
  carbon_uncertainty_pct: "carbon content uncertainty",
  cv_uncertainty_pct: "calorific value uncertainty",
  systematic_pct: "repeating share of the meter's uncertainty",
  calibrated_on: "calibration date",
  metered: "metered",
  source: "source",
  stream: "stream",
};

const TOP_WORDS: Record<string, string> = {
  month: "Month",
  site: "Site",
  format: "Format",
  method: "Method",
  emissions_method: "Emissions method",
  factor_set: "Factor set",
  "method.factor_set": "Factor set",
  "method.emissions": "Emissions method",
  "method.gwp": "GWP set",
  "balances.carbon": "Carbon balance",
  "balances.nitrogen": "Nitrogen balance",
  "balances.hydrogen": "Hydrogen balance",
  reason: "Reason",
  body: "The request",
  "": "The document",
  document: "The document",
  figures: "The figures",
};

const field = (f: string | undefined) => (f ? (FIELD_WORDS[f] ?? f.replace(/_/g, " ")) : "");

/** `streams[2].quantity` → "Stream fuel: quantity" (given the streams' ids in document order). */
export function plainPath(path: string, streamIds: readonly string[] = []): string {
  if (path in TOP_WORDS) return TOP_WORDS[path];
  let m = /^streams\[(\d+)\](?:\.(\w+))?/.exec(path);
  if (m) {
    const i = Number(m[1]);
    return `Stream ${streamIds[i] ?? `no. ${i + 1}`}${m[2] ? `: ${field(m[2])}` : ""}`;
  }
  m = /^readings\[(\d+)\](?:\.(\w+))?/.exec(path);
  if (m) return `Reading ${streamIds[Number(m[1])] ?? `no. ${Number(m[1]) + 1}`}${m[2] ? `: ${field(m[2])}` : ""}`;
  m = /^readings\.([\w-]+)$/.exec(path);
  if (m) return `Reading of ${m[1]}`;
  m = /^analyses(?:\.([\w .-]+?)|\[(\d+)\])(?:\.(components)(?:\.(\w+))?|\.(\w+))?$/.exec(path);
  if (m) {
    const name = m[1] ?? `no. ${Number(m[2]) + 1}`;
    if (m[3]) return `Analysis ${name}: ${m[4] ? `component ${m[4]}` : "components"}`;
    return `Analysis ${name}${m[5] ? `: ${field(m[5])}` : ""}`;
  }
  return path.replace(/\./g, " › ");
}

/** A message as a sentence: capital first letter, full stop at the end. */
export function sentence(message: string): string {
  const t = message.trim();
  if (!t) return t;
  const first = t[0].toUpperCase() + t.slice(1);
  return /[.!?)]$/.test(first) ? first : `${first}.`;
}

/** "Stream fuel: quantity: must be…" → one readable line. */
export const plainIssue = (path: string, message: string, streamIds: readonly string[] = []) => `${plainPath(path, streamIds)}: ${message.replace(/\.$/, "")}.`;
