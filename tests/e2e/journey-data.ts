/**
 * The invented plant of the end-to-end journey and its files: six streams of a ~1 500 t/d
 * natural-gas ammonia plant and one month of daily meter totals that close all three balances
 * within 0.1 % (checked with `npm run balance` on the same monthly totals; carbon −0.09 %,
 * nitrogen −0.06 %, hydrogen −0.05 %), plus the month's lab analysis of the grid gas.
 */

export interface JourneyStream {
  key: string;
  name: string;
  /** Option text of the stream form's Kind list. */
  kindLabel: string;
  unit: string;
  analysisKey?: string;
  destination?: string;
  uncertaintyPct: string;
  meterTag: string;
  /** Monthly total in the stream's unit, as the month page should show it after the import. */
  total: string;
  /** Decimal places of the daily values in the file. */
  decimals: 0 | 1;
}

export const ANALYSIS_KEY = "grid-gas";
export const PERIOD = "2026-10";
export const PERIOD_LABEL = "October 2026";
const DAYS = 31;

export const JOURNEY_STREAMS: JourneyStream[] = [
  { key: "feed", name: "Feed gas", kindLabel: "Feed gas", unit: "Sm3", analysisKey: ANALYSIS_KEY, uncertaintyPct: "1", meterTag: "JW-FQ-101", total: "27666755", decimals: 0 },
  { key: "fuel", name: "Fuel gas", kindLabel: "Fuel gas", unit: "Sm3", analysisKey: ANALYSIS_KEY, uncertaintyPct: "1.5", meterTag: "JW-FQ-102", total: "10134887", decimals: 0 },
  { key: "air", name: "Process air", kindLabel: "Process air", unit: "Nm3", uncertaintyPct: "2", meterTag: "JW-FQ-201", total: "38700000", decimals: 0 },
  { key: "nh3", name: "Ammonia to storage", kindLabel: "Ammonia product", unit: "t", uncertaintyPct: "0.5", meterTag: "JW-WQ-501", total: "46400", decimals: 1 },
  { key: "co2-urea", name: "CO2 to the urea plant", kindLabel: "CO2 export", unit: "t", destination: "urea", uncertaintyPct: "1", meterTag: "JW-FQ-301", total: "53219.5", decimals: 1 },
  { key: "stack", name: "Reformer stack CO2", kindLabel: "CO2 in flue gas (monitor)", unit: "t", uncertaintyPct: "5", meterTag: "JW-AQ-601", total: "21076.4", decimals: 1 },
];

/** Grid gas as sampled mid-month, mol % dry (sums to 100). */
export const GRID_GAS: Record<string, string> = { CH4: "92.4", C2H6: "4.1", C3H8: "0.8", iC4H10: "0.1", nC4H10: "0.15", nC5H12: "0.05", N2: "1.2", CO2: "1.2" };

/** The day and stream whose cell the historian exported with its unit stuck to it. */
export const BAD = { day: 16, stream: "nh3" } as const;
/** Spreadsheet row of BAD: the header is row 1, so day d is row d + 1. */
export const BAD_ROW = BAD.day + 1;

const scale = (s: JourneyStream) => 10 ** s.decimals;

/** Daily values in integer steps of the last decimal that add up exactly to the monthly total. */
function dailySteps(s: JourneyStream): number[] {
  const total = Math.round(Number(s.total) * scale(s));
  const weights = Array.from({ length: DAYS }, (_, d) => 1 + 0.025 * Math.sin((2 * Math.PI * d) / 7) + 0.015 * Math.cos(d * 1.3));
  const sum = weights.reduce((a, b) => a + b, 0);
  const steps = weights.map((w) => Math.round((total * w) / sum));
  steps[DAYS - 1] += total - steps.reduce((a, b) => a + b, 0);
  return steps;
}

function text(steps: number, s: JourneyStream): string {
  if (s.decimals === 0) return String(steps);
  return `${Math.floor(steps / 10)}.${steps % 10}`;
}

/** Daily values of one stream as the file writes them. */
export function dailyValue(s: JourneyStream, day: number): string {
  return text(dailySteps(s)[day - 1], s);
}

/**
 * The historian's export: one row per day, one column per meter tag. With `bad`, the row of
 * BAD carries e.g. "1540.8 t" instead of "1540.8": text in a number column.
 */
export function meterCsv(bad: boolean): string {
  const columns = JOURNEY_STREAMS.map((s) => ({ s, steps: dailySteps(s) }));
  const lines = [["date", ...JOURNEY_STREAMS.map((s) => s.meterTag)].join(",")];
  for (let d = 1; d <= DAYS; d++) {
    const cells = columns.map(({ s, steps }) => {
      const v = text(steps[d - 1], s);
      return bad && d === BAD.day && s.key === BAD.stream ? `${v} t` : v;
    });
    lines.push([`${PERIOD}-${String(d).padStart(2, "0")}`, ...cells].join(","));
  }
  return `${lines.join("\n")}\n`;
}

/** The laboratory's export: one sample of the grid gas that feeds both the reformer and the burners. */
export function labCsv(): string {
  const comps = Object.keys(GRID_GAS);
  return `date,sample point,${comps.join(",")}\n${PERIOD}-14,${ANALYSIS_KEY},${comps.map((c) => GRID_GAS[c]).join(",")}\n`;
}

/** A decimal text without trailing zeros ("46400.0" → "46400"), for comparing totals. */
export function plainDecimal(v: string): string {
  const t = v.trim();
  return t.includes(".") ? t.replace(/0+$/, "").replace(/\.$/, "") : t;
}
