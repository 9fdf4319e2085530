/**
 * Browser test of the overview and a site's trends, called from run.ts: the demo signatory
 * opens the overview (sites with their benchmark position), goes to a site's trends in one
 * click, and the charts draw from the series endpoint; the table view shows the same months.
 */
import type { Browser, Page } from "playwright-core";
import { DEMO_USERS } from "../../db/demo-users";

export interface OverviewKit {
  browser: Browser;
  base: string;
  viewport: { width: number; height: number };
  check: (name: string, fn: () => Promise<void>) => Promise<void>;
  assert: (cond: unknown, message: string) => asserts cond;
  shot: (page: Page, name: string) => Promise<void>;
  signIn: (page: Page, email: string, password: string) => Promise<void>;
}

export async function overviewChecks(k: OverviewKit): Promise<void> {
  const assert: OverviewKit["assert"] = k.assert;
  const signatory = DEMO_USERS.find((u) => u.roles.includes("signatory"))!;
  const page = await (await k.browser.newContext({ viewport: k.viewport })).newPage();
  // The overview runs the engine on a year per site; a cold development server compiles first.
  page.setDefaultTimeout(60_000);
  page.setDefaultNavigationTimeout(90_000);

  await k.check("signatory sees every site's year and its benchmark position on the overview", async () => {
    await k.signIn(page, signatory.email, signatory.password);
    await page.waitForURL(`${k.base}/`, { timeout: 30_000 });
    await page.getByRole("heading", { name: "Overview" }).waitFor();
    for (const site of ["Estuary Works", "Dunmoor Works"]) await page.getByRole("heading", { name: new RegExp(site) }).waitFor({ timeout: 90_000 });
    const text = await page.locator("main").innerText();
    assert(/Against the factor set.s benchmarks/i.test(text), "benchmark block missing");
    assert(/Latest closures/i.test(text), "closures missing");
    assert(/Waiting for someone/.test(text), "attention list missing");
    await k.shot(page, "overview-01-signatory");
  });

  await k.check("one click from the overview opens a site's trends with charts drawn from data", async () => {
    const card = page.locator("section", { has: page.getByRole("heading", { name: /Estuary Works/ }) }).first();
    await card.getByRole("link", { name: "Trends" }).click();
    await page.waitForURL(/\/sites\/[^/]+\/trends/);
    for (const id of ["production", "intensity", "energy", "closures", "ratio", "suspects"]) {
      await page.locator(`figure[data-chart=${id}] svg`).first().waitFor({ timeout: 90_000 });
    }
    const curves = await page.locator("figure[data-chart=closures] path.recharts-curve").count();
    assert(curves >= 3, `closure chart draws ${curves} lines`);
    const bars = await page.locator("figure[data-chart=production] path.recharts-rectangle").count();
    assert(bars === 12, `production chart draws ${bars} bars`);
    await k.shot(page, "overview-02-trends");
  });

  await k.check("the table view shows the same twelve months", async () => {
    await page.getByRole("button", { name: "Table" }).click();
    const rows = page.locator("table tbody tr");
    await rows.first().waitFor();
    assert((await rows.count()) === 12, "twelve month rows expected");
    assert(await page.getByRole("columnheader", { name: /CO2e intensity/ }).isVisible(), "intensity column missing");
    await k.shot(page, "overview-03-trends-table");
  });

  await page.context().close();
}
