// The annual statement's section 9 (issue 14): the EU trading-system monitoring check and CBAM
// embedded emissions of the demo's Estuary year, printed with units and the figures the engine gives.
import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { calculate } from "@/lib/balance/calculate";
import { demoPlantMonths } from "@/lib/demo/scenario";
import type { MonthRun } from "@/lib/ledger/year";
import { yearEuEtsAndCbam } from "@/lib/ledger/year";
import { euEtsSection } from "@/reports/build-annual-model";
import { fixed } from "@/reports/format";
import { renderAnnualStatement } from "@/reports/render";
import { sampleAnnual } from "./sample-models";

const now = new Date("2027-01-15T00:00:00Z");
const runs = demoPlantMonths("estuary").map((doc) => ({ period: doc.month, state: "signed", result: calculate(doc) }) as unknown as MonthRun);

describe("annual statement, section 9", () => {
  it("prints the category, materiality, source streams and the CBAM figures per tonne", async () => {
    const section = euEtsSection("2026", runs, now)!;
    const figures = yearEuEtsAndCbam("2026", runs, now)!;
    const pdf = await renderAnnualStatement({ ...sampleAnnual, euEts: section });
    const dir = mkdtempSync(path.join(tmpdir(), "synledger-eu-"));
    const file = path.join(dir, "annual-eu.pdf");
    writeFileSync(file, pdf);
    if (process.env.KEEP_PDF) writeFileSync(process.env.KEEP_PDF, pdf);
    const text = execFileSync("pdftotext", [file, "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
    expect(text).toContain("EU emissions trading monitoring check and CBAM embedded emissions");
    expect(text).toContain(`${figures.euEts.installation_category} (Reg. (EU) 2018/2066 Art 19(2)`);
    expect(text).toContain(`${fixed(figures.cbam.see_direct_t_per_t, 4)} t CO2e/t NH3`);
    expect(text).toContain("CN 2814 10 00 (unconfirmed)");
    for (const s of figures.euEts.source_streams) expect(text).toContain(s.id);
  });
});
