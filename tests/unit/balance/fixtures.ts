// Hand-built plant-months for the tests. The pure-methane plant is constructed on paper:
// air 100 000 kmol of N2 78.084 / O2 20.948 / Ar 0.968 (Ar inert, sums to 100) carries
// 78 084 kmol N2 → 156 168 kmol NH3 (N2 + 3 H2 → 2 NH3) needing 234 252 kmol H2; the air O2
// burns 2 × 20 948 = 41 896 kmol H2; CH4 + 2 H2O → CO2 + 4 H2 then needs
// (234 252 + 41 896) / 4 = 69 037 kmol CH4 feed, which leaves as 69 037 kmol CO2.
// Fuel 10 000 kmol CH4 leaves as 10 000 kmol stack CO2. Masses with CIAAW 2021 weights:
// CH4 16.043, NH3 17.031, CO2 44.009, air 28.9641088 kg/kmol (hand calc).
export const STOICH_PLANT = {
  format: "synledger.plant-month/1",
  site: "Paper plant",
  month: "2026-01",
  analyses: {
    methane: { components: { CH4: "100" } },
    air: { components: { N2: "78.084", O2: "20.948", Ar: "0.968" } },
  },
  streams: [
    { id: "feed", kind: "feed-gas", analysis: "methane", quantity: "1107.560591", unit: "t", uncertainty_pct: "1.0" },
    { id: "fuel", kind: "fuel-gas", analysis: "methane", quantity: "160.43", unit: "t", uncertainty_pct: "2.0" },
    { id: "air", kind: "process-air", analysis: "air", quantity: "2896.41088", unit: "t", uncertainty_pct: "2.0" },
    { id: "nh3", kind: "ammonia", quantity: "2659.697208", unit: "t", uncertainty_pct: "0.5" },
    { id: "urea", kind: "co2-export", destination: "urea", quantity: "3038.249333", unit: "t", uncertainty_pct: "1.0" },
    { id: "stack", kind: "stack-co2", quantity: "440.09", unit: "t", uncertainty_pct: "5.0" },
  ],
  method: { emissions: "carbon-mass-balance", factor_set: "ipcc-2006", gwp: "AR5" },
};

export const stoichText = () => JSON.stringify(STOICH_PLANT);

/** The fixture as loose JSON: a bad-input case may put anything anywhere, which no precise type allows. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type LooseDoc = any;

/** A deep copy with edits applied, for the bad-input cases. */
export function variant(edit: (doc: LooseDoc) => void): LooseDoc {
  const doc = JSON.parse(JSON.stringify(STOICH_PLANT));
  edit(doc);
  return doc;
}
