/**
 * Journey, step 1: the demo administrator sets up a new site and its streams through the
 * settings pages (Settings → Sites and meters → Set up a site → Add a stream, six times).
 */
import type { Page } from "playwright-core";
import { JOURNEY_STREAMS, type JourneyStream } from "./journey-data";
import type { E2eKit } from "./lifecycle";

export interface JourneySite {
  id: string;
  name: string;
  code: string;
}

/** A site name and code no earlier run used: the database is kept between runs. */
export function freshSite(): Omit<JourneySite, "id"> {
  const stamp = Date.now().toString(36);
  return { name: `Harrowgate Ammonia ${stamp}`, code: `hga-${stamp}` };
}

export async function setUpSite(k: E2eKit, page: Page, site: Omit<JourneySite, "id">): Promise<string> {
  const assert: E2eKit["assert"] = k.assert;
  await page.goto(`${k.base}/`);
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Settings" }).click();
  await page.waitForURL(/\/settings\//);
  await page.getByRole("link", { name: "Sites and meters" }).click();
  await page.waitForURL(/\/settings\/sites$/);
  await page.getByRole("link", { name: "Set up a site" }).click();
  await page.getByRole("heading", { name: "Set up a site" }).waitFor();
  // The form is a client component: hydrated once its submit button is enabled and wired.
  await page.waitForLoadState("networkidle");
  await page.getByLabel("Name", { exact: true }).fill(site.name);
  await page.getByLabel("Code", { exact: true }).fill(site.code);
  await page.getByLabel("Balance tolerance (%)").fill("2");
  await page.getByLabel("Emissions method").selectOption({ label: "Carbon mass balance" });
  await page.getByRole("button", { name: "Set up site" }).click();
  await page.waitForURL(/\/settings\/sites\/[0-9a-f-]{36}\?created=1$/, { timeout: 20_000 });
  await page.getByRole("heading", { name: site.name, exact: true }).waitFor();
  await page.getByText(`${site.name} is set up`).waitFor();
  await page.getByText("No streams yet").waitFor();
  const id = /\/settings\/sites\/([0-9a-f-]{36})\?created=1$/.exec(page.url())?.[1];
  assert(id, `no site id in ${page.url()}`);
  return id;
}

/** The installation identity, which a site needs before its months go for sign-off. */
export async function setUpInstallation(k: E2eKit, page: Page, site: Omit<JourneySite, "id">): Promise<void> {
  await page.getByRole("heading", { name: "Installation identity" }).waitFor();
  await page.getByText("Needed before a month of this site can go for sign-off").waitFor();
  await page.getByLabel("Operator's legal name").fill(`${site.name} Operating Company Ltd`);
  await page.getByLabel("Competent authority").fill("Journey Regional Environment Office");
  await page.getByLabel("Installation address").fill(`${site.name}, 3 Test Quay, Journeytown`);
  await page.getByRole("button", { name: "Add an identifier" }).click();
  await page.getByLabel("Scheme 1", { exact: true }).fill("EU ETS permit");
  await page.getByLabel("Identifier 1", { exact: true }).fill(`JT-${site.code.toUpperCase()}`);
  await page.getByLabel("Monitoring-plan reference").fill("MP-JT-01");
  await page.getByLabel("Version", { exact: true }).fill("1");
  await page.getByLabel("Reporting contact").fill("Journey Contact");
  await page.getByLabel("Contact e-mail").fill("contact@journey.example");
  await page.getByRole("button", { name: "Save installation identity" }).click();
  await page.getByText("Installation identity saved and complete").waitFor({ timeout: 20_000 });
  await k.shot(page, "journey-01b-installation");
}

async function addStream(page: Page, siteId: string, s: JourneyStream): Promise<void> {
  await page.getByRole("link", { name: "Add a stream" }).first().click();
  await page.waitForURL(new RegExp(`/settings/sites/${siteId}/streams/new$`));
  await page.waitForLoadState("networkidle");
  await page.getByLabel("Key", { exact: true }).fill(s.key);
  await page.getByLabel("Name", { exact: true }).fill(s.name);
  await page.getByLabel("Kind", { exact: true }).selectOption({ label: s.kindLabel });
  await page.getByLabel("Usual unit").selectOption(s.unit);
  if (s.analysisKey) await page.getByLabel("Analysis key", { exact: true }).fill(s.analysisKey);
  if (s.destination) await page.getByLabel("Destination").selectOption(s.destination);
  await page.getByLabel("Uncertainty (± %, 95 %)").fill(s.uncertaintyPct);
  await page.getByLabel("Meter tag").fill(s.meterTag);
  await page.getByRole("button", { name: "Add stream" }).click();
  await page.waitForURL(new RegExp(`/settings/sites/${siteId}$`), { timeout: 20_000 });
  await page.getByRole("link", { name: `Edit stream ${s.key}` }).waitFor();
}

/** Adds every stream of the journey and checks the site's table lists each with its set-up. */
export async function setUpStreams(k: E2eKit, page: Page, siteId: string): Promise<void> {
  const assert: E2eKit["assert"] = k.assert;
  for (const s of JOURNEY_STREAMS) await addStream(page, siteId, s);
  const table = page.getByRole("table");
  for (const s of JOURNEY_STREAMS) {
    const row = table.getByRole("row").filter({ has: page.getByRole("link", { name: `Edit stream ${s.key}` }) });
    const text = await row.innerText();
    assert(text.includes(s.name) && text.includes(s.meterTag) && text.includes(s.unit), `stream ${s.key} listed as: ${text.replace(/\s+/g, " ")}`);
    if (s.analysisKey) assert(text.includes(s.analysisKey), `stream ${s.key} lost its analysis key`);
    if (s.destination) assert(text.includes(s.destination), `stream ${s.key} lost its destination`);
  }
}
