import { D, type Decimal } from "./decimal";
import type { GwpId } from "./types";

export interface GwpSet {
  id: GwpId;
  ch4: Decimal;
  n2o: Decimal;
  source: string;
  status: "confirmed" | "unconfirmed";
  /** Where the published values were read, when confirmed. */
  checked?: string;
  note?: string;
}

/** 100-year global warming potentials. CH4 in AR6 is the fossil value: the methane here is fossil. */
export const GWP_SETS: Record<GwpId, GwpSet> = {
  AR4: { id: "AR4", ch4: new D(25), n2o: new D(298), status: "confirmed",
    source: "IPCC AR4 WG1 Table 2.14, as carried in 40 CFR 98 Table A-1 (text before the 2024 amendment) and Directive (EU) 2015/652 Annex I",
    checked: "40 CFR 98 Table A-1 in a verbatim eCFR reproduction; Directive (EU) 2015/652 Annex I on legislation.gov.uk (CO2 1, CH4 25, N2O 298)" },
  AR5: { id: "AR5", ch4: new D(28), n2o: new D(265), status: "unconfirmed",
    source: "IPCC AR5 WG1 Table 8.7 (said to be carried in 40 CFR 98 Table A-1 from 2025)" },
  AR6: { id: "AR6", ch4: new D("29.8"), n2o: new D(273), status: "unconfirmed",
    source: "IPCC AR6 WG1 Table 7.15", note: "fossil CH4 29.8; non-fossil 27.0" },
};

export function gwpSet(id: GwpId): GwpSet {
  const g = GWP_SETS[id];
  if (!g) throw new Error(`unknown GWP set "${id}"`);
  return g;
}
