/**
 * Browser test of the month entry form, called from run.ts: the demo engineer types a fresh
 * month of Estuary Works by keyboard only, watches the balance close, saves with Ctrl+S and
 * finds the same figures after a reload; a second, stale tab gets the conflict message with its
 * entries kept; the demo auditor sees the month read-only.
 */
import type { Browser, Page } from "playwright-core";
import { DEMO_USERS } from "../../db/demo-users";
import { demoSite } from "../../lib/demo/scenario";

export interface E2eKit {
  base: string;
  viewport: { width: number; height: number };
  check(name: string, fn: () => Promise<void>): Promise<void>;
  assert(cond: unknown, message: string): asserts cond;
  shot(page: Page, name: string): Promise<void>;
  signIn(page: Page, email: string, password: string): Promise<void>;
}

const engineer = DEMO_USERS.find((u) => u.roles.includes("process_engineer"))!;
const auditor = DEMO_USERS.find((u) => u.roles.includes("auditor"))!;

// Plausible Estuary Works totals in stream order (feed, fuel, air, purge, nh3, co2-urea, co2-vent, stack, power).
const TOTALS = ["27666755", "10134887", "38006209", "4666823", "43763.5", "47569.5", "5650", "21076.4", "3031.3"];

export async function runMonthEntry(browser: Browser, kit: E2eKit): Promise<void> {
  const { base, check, shot } = kit;
  const assert: E2eKit["assert"] = (cond, message) => kit.assert(cond, message);
  // A month nobody has touched, so the test starts from an empty form on every run.
  // A past month the demo does not hold (figures of future months are refused), random so re-runs find it empty.
  const year = 2000 + Math.floor(Math.random() * 25);
  const monthNo = 2 + Math.floor(Math.random() * 11);
  const period = `${year}-${String(monthNo).padStart(2, "0")}`;
  const previous = `${year}-${String(monthNo - 1).padStart(2, "0")}`;
  // Two decimals, the last never 0: the month stores 43763.30 as 43763.3, which would read back differently.
  const digit = () => String(Math.floor(Math.random() * 9) + 1);
  const nh3 = `43763.${digit()}${digit()}`;
  TOTALS[4] = nh3;
  let url = "";

  const page = await (await browser.newContext({ viewport: kit.viewport })).newPage();
  await check("engineer opens a fresh month of Estuary Works", async () => {
    await kit.signIn(page, engineer.email, engineer.password);
    await page.waitForURL(`${base}/`, { timeout: 20_000 });
    const siteId = await page.locator("#ctx-site option", { hasText: "Estuary Works" }).getAttribute("value");
    assert(siteId, "Estuary Works is not in the site picker");
    // The month before holds the lab analyses, as a running plant's ledger would; the form offers to start from them.
    for (const [key, components] of Object.entries(demoSite("estuary").analyses)) {
      const res = await page.request.put(`${base}/api/v1/sites/${siteId}/months/${previous}/analyses/${key}`, {
        data: { components },
        headers: { origin: base },
      });
      assert(res.ok(), `analysis ${key} of ${previous} not stored: ${res.status()} ${await res.text()}`);
    }
    url = `${base}/sites/${siteId}/months/${period}`;
    await page.goto(url);
    await page.locator("form[data-interactive]").waitFor();
    assert((await page.locator("#reading-0-quantity").inputValue()) === "", "a fresh month should start empty");
  });

  await check("engineer types every total by keyboard, Enter moving down the rows", async () => {
    await page.locator("#reading-0-quantity").focus();
    for (const t of TOTALS) {
      await page.keyboard.type(t);
      await page.keyboard.press("Enter");
    }
    for (let i = 0; i < TOTALS.length; i++) {
      assert((await page.locator(`#reading-${i}-quantity`).inputValue()) === TOTALS[i], `row ${i} holds ${await page.locator(`#reading-${i}-quantity`).inputValue()}`);
    }
    // The compositions start from last month's analyses, taken by keyboard.
    for (const key of ["estuary-grid-gas", "estuary-purge"]) {
      const start = page.getByRole("region", { name: `Analysis ${key}` }).getByRole("button", { name: /^Start from the / });
      await start.focus();
      await page.keyboard.press("Enter");
    }
  });

  await check("the balance beside the form closes while typing", async () => {
    const panel = page.getByRole("region", { name: "Balance as typed" });
    await panel.getByText("Carbon", { exact: true }).waitFor();
    await page.waitForFunction(() => /Closes|Outside/.test(document.getElementById("live-balance-panel")?.textContent ?? ""), null, { timeout: 15_000 });
    const text = await panel.innerText();
    assert(/Carbon\s*[+\u2212-]\d+\.\d\d %/.test(text), `no carbon closure shown: ${text.slice(0, 200)}`);
    assert(/t CO2e\/t NH3/.test(text) && /GJ \(LHV\)\/t NH3/.test(text), "intensities missing");
    await shot(page, "40-month-entry-live-balance");
  });

  await check("Ctrl+S saves, and a reload shows the same figures", async () => {
    await page.keyboard.press("Control+s");
    await page.getByText(/^Saved \d+ changes?\. Version 1\.$/).waitFor({ timeout: 20_000 });
    await page.reload();
    await page.locator("form[data-interactive]").waitFor();
    for (let i = 0; i < TOTALS.length; i++) {
      const v = await page.locator(`#reading-${i}-quantity`).inputValue();
      assert(v === TOTALS[i], `after reload row ${i} is ${v}, typed ${TOTALS[i]}`);
    }
    await shot(page, "41-month-entry-saved");
  });

  await check("a stale second tab gets the conflict message and keeps its entries", async () => {
    const stale = await (await browser.newContext({ viewport: kit.viewport })).newPage();
    await kit.signIn(stale, engineer.email, engineer.password);
    await stale.waitForURL(`${base}/`, { timeout: 20_000 });
    await stale.goto(url);
    await stale.locator("form[data-interactive]").waitFor();
    await page.locator("#reading-6-quantity").fill("5700");
    await page.keyboard.press("Control+s");
    await page.getByText(/Version 2\.$/).waitFor({ timeout: 20_000 });
    await stale.locator("#reading-6-quantity").fill("5600");
    await stale.keyboard.press("Control+s");
    await stale.getByText("Not saved: someone else saved this month first").waitFor({ timeout: 20_000 });
    assert(await stale.getByText(/co2-vent/).first().isVisible(), "the changed stream is not named");
    assert((await stale.locator("#reading-6-quantity").inputValue()) === "5600", "the stale tab lost its entry");
    await shot(stale, "42-month-entry-conflict");
    await stale.getByRole("button", { name: "Load their figures (discards yours)" }).click();
    await stale.getByText("Loaded the figures saved in version 2.").waitFor({ timeout: 20_000 });
    assert((await stale.locator("#reading-6-quantity").inputValue()) === "5700", "their figure was not loaded");
    await stale.context().close();
  });

  await check("auditor sees the month read-only", async () => {
    const ro = await (await browser.newContext({ viewport: kit.viewport })).newPage();
    await kit.signIn(ro, auditor.email, auditor.password);
    await ro.waitForURL(`${base}/`, { timeout: 20_000 });
    await ro.goto(url);
    await ro.getByText("Read only", { exact: true }).waitFor();
    assert(await ro.locator("#reading-4-quantity").isDisabled(), "quantity input is editable for the auditor");
    assert((await ro.locator("#reading-4-quantity").inputValue()) === nh3, "auditor does not see the saved figure");
    assert((await ro.getByRole("button", { name: "Save figures" }).count()) === 0, "auditor has a save button");
    await shot(ro, "43-month-entry-auditor-read-only");
    await ro.context().close();
  });
  await page.context().close();
}
