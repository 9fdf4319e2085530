/**
 * Journey, step 2: the demo process engineer opens the new site's month from the site picker,
 * goes to the CSV import, gets the one bad row named at the check, imports the corrected file
 * and the lab analysis, and finds the totals on the month page.
 */
import { writeFileSync } from "node:fs";
import type { Page } from "playwright-core";
import { ANALYSIS_KEY, BAD, BAD_ROW, GRID_GAS, JOURNEY_STREAMS, PERIOD, PERIOD_LABEL, dailyValue, labCsv, meterCsv, plainDecimal } from "./journey-data";
import type { JourneySite } from "./journey-setup";
import type { E2eKit } from "./lifecycle";

const FILE_LABEL = "CSV file from the plant historian, the DCS or the laboratory";

export interface JourneyFiles {
  bad: string;
  fixed: string;
  lab: string;
}

/** Writes the three files next to the screenshots (the same each run; every run has its own site). */
export function writeJourneyFiles(out: string): JourneyFiles {
  const files = { bad: `${out}/journey-meters-${PERIOD}.csv`, fixed: `${out}/journey-meters-${PERIOD}-fixed.csv`, lab: `${out}/journey-lab-${PERIOD}.csv` };
  writeFileSync(files.bad, meterCsv(true));
  writeFileSync(files.fixed, meterCsv(false));
  writeFileSync(files.lab, labCsv());
  return files;
}

/** Site picker → the month → its link to the import wizard. */
export async function openImport(k: E2eKit, page: Page, site: JourneySite): Promise<void> {
  await page.goto(`${k.base}/`);
  await page.waitForLoadState("networkidle");
  await page.getByLabel("Site", { exact: true }).selectOption({ label: `${site.name} (${site.code})` });
  await page.getByLabel("Month", { exact: true }).fill(PERIOD);
  await page.getByRole("button", { name: "Open month" }).click();
  await page.waitForURL(`${k.base}/sites/${site.id}/months/${PERIOD}`);
  await page.getByRole("heading", { name: PERIOD_LABEL }).waitFor();
  await page.getByRole("link", { name: "import figures from a CSV file" }).click();
  await page.waitForURL(`${k.base}/sites/${site.id}/import`);
  await page.getByRole("heading", { name: "Import figures from a CSV file" }).waitFor();
  // The wizard is a client component: a file chosen before hydration would not reach its state.
  await page.waitForLoadState("networkidle");
}

/** File → columns (checking the guessed mapping) → check; leaves the page on the check step. */
export async function chooseAndCheck(k: E2eKit, page: Page, file: string, expectLayout: "wide" | "analyses"): Promise<void> {
  const assert: E2eKit["assert"] = k.assert;
  await page.getByLabel(FILE_LABEL).setInputFiles(file);
  await page.getByRole("button", { name: "Next: columns" }).click();
  await page.getByRole("heading", { name: "Say what each column holds" }).waitFor();
  if (expectLayout === "wide") {
    for (const s of JOURNEY_STREAMS) {
      const v = await page.getByLabel(`Stream for column ${s.meterTag}`).inputValue();
      assert(v === s.key, `column ${s.meterTag} mapped to "${v}", expected ${s.key}`);
    }
  } else {
    assert(await page.getByRole("radio", { name: "Lab analyses, one column per component" }).isChecked(), "the lab file was not read as analyses");
  }
  await page.getByRole("button", { name: "Next: check every row" }).click();
  await page.getByRole("button", { name: /^Import \d+ months?$/ }).waitFor({ timeout: 30_000 });
}

/** The check names the bad row, column and reason, and refuses to import. */
export async function expectBadRowNamed(k: E2eKit, page: Page): Promise<void> {
  const assert: E2eKit["assert"] = k.assert;
  const tag = JOURNEY_STREAMS.find((s) => s.key === BAD.stream)!.meterTag;
  const badCell = `${dailyValue(JOURNEY_STREAMS.find((s) => s.key === BAD.stream)!, BAD.day)} t`;
  await page.getByText("1 problem in the file: nothing can be imported until they are fixed").waitFor();
  const problems = page.getByRole("table", { name: /^Problems found in / });
  const rows = problems.getByRole("row");
  assert((await rows.count()) === 2, `expected one problem row, table has ${(await rows.count()) - 1}`);
  const cells = (await rows.nth(1).getByRole("cell").allInnerTexts()).map((c) => c.trim());
  assert(cells[0] === String(BAD_ROW), `problem names row ${cells[0]}, the bad value is on row ${BAD_ROW}`);
  assert(cells[1] === tag, `problem names column ${cells[1]}, expected ${tag}`);
  assert(cells[2].includes(`"${badCell}"`) && /not a number/.test(cells[2]), `reason: ${cells[2]}`);
  assert(await page.getByRole("button", { name: "Import 1 month" }).isDisabled(), "import allowed with a bad row");
}

/** The corrected file checks clean, its totals are the month's, and it imports. */
export async function importClean(k: E2eKit, page: Page, file: string): Promise<void> {
  const assert: E2eKit["assert"] = k.assert;
  await page.getByRole("button", { name: "Choose another file" }).click();
  await page.getByRole("heading", { name: "Choose the file" }).waitFor();
  await chooseAndCheck(k, page, file, "wide");
  await page.getByText("Every row is readable").waitFor();
  const plan = page.getByRole("table").filter({ hasText: "Total from the file" });
  for (const s of JOURNEY_STREAMS) {
    const row = plan.getByRole("row").filter({ hasText: s.name });
    const total = (await row.getByRole("cell").nth(1).innerText()).trim();
    assert(plainDecimal(total.split(/\s+/)[0]) === s.total && total.endsWith(s.unit), `${s.key}: file total ${total}, expected ${s.total} ${s.unit}`);
    const values = (await row.getByRole("cell").nth(2).innerText()).trim();
    assert(values === "31", `${s.key}: ${values} daily values summed, expected 31`);
  }
}

export async function commitImport(k: E2eKit, page: Page, fileName: string): Promise<void> {
  await page.getByRole("button", { name: "Import 1 month" }).click();
  await page.getByText(`Imported ${fileName}`).waitFor({ timeout: 30_000 });
  await page.getByRole("link", { name: PERIOD_LABEL }).waitFor();
}

/** The month page holds the file's totals in every stream's row and the lab analysis. */
export async function expectMonthTotals(k: E2eKit, page: Page, site: JourneySite): Promise<void> {
  const assert: E2eKit["assert"] = k.assert;
  await page.getByRole("link", { name: PERIOD_LABEL }).click();
  await page.waitForURL(`${k.base}/sites/${site.id}/months/${PERIOD}`);
  await page.locator("form[data-interactive]").waitFor();
  for (const s of JOURNEY_STREAMS) {
    const v = await page.getByLabel(s.name, { exact: true }).inputValue();
    assert(plainDecimal(v) === s.total, `${s.name}: month page shows ${v}, the file adds up to ${s.total}`);
  }
  const ch4 = await page.getByRole("region", { name: `Analysis ${ANALYSIS_KEY}` }).getByLabel("CH4", { exact: true }).inputValue();
  assert(plainDecimal(ch4) === GRID_GAS.CH4, `grid gas CH4 shows ${ch4}, the lab file has ${GRID_GAS.CH4}`);
  await page.getByRole("region", { name: "Balance as typed" }).getByText("Carbon", { exact: true }).waitFor();
}
