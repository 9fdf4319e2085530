/**
 * The end-to-end journey, called from run.ts: the administrator sets up a new site and its
 * streams; the process engineer imports a month from CSV (one bad row named, the corrected file
 * imported, then the lab analysis), sees the totals and closes the balance; the environmental
 * officer sends it for sign-off; the signatory signs; the auditor downloads the signed PDF and
 * verifies it (issued) and a copy with one signed byte changed (altered). Each run sets up its
 * own site, so it is re-runnable on the same database and needs nothing from the other checks.
 * Screenshots: test-results/e2e/journey-NN-*.png.
 */
import { readFileSync } from "node:fs";
import { basename } from "node:path";
import type { Page } from "playwright-core";
import { DEMO_USERS } from "../../db/demo-users";
import { PERIOD, PERIOD_LABEL } from "./journey-data";
import { chooseAndCheck, commitImport, expectBadRowNamed, expectMonthTotals, importClean, openImport, writeJourneyFiles } from "./journey-import";
import { tamperSignedByte } from "./journey-pdf";
import { freshSite, setUpInstallation, setUpSite, setUpStreams, type JourneySite } from "./journey-setup";
import type { E2eKit } from "./lifecycle";

const user = (role: string) => DEMO_USERS.find((u) => u.roles.includes(role as never))!;

export async function journeyChecks(k: E2eKit): Promise<void> {
  const assert: E2eKit["assert"] = k.assert;
  const named = freshSite();
  const site: JourneySite = { ...named, id: "" };
  const files = writeJourneyFiles(k.out);
  const review = () => `${k.base}/sites/${site.id}/months/${PERIOD}/review`;
  let pdfPath = "";

  const pageAs = async (role: string): Promise<Page> => {
    const page = await (await k.browser.newContext({ viewport: k.viewport, acceptDownloads: true })).newPage();
    page.setDefaultTimeout(30_000);
    const u = user(role);
    await k.signIn(page, u.email, u.password);
    await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"), { timeout: 20_000 });
    return page;
  };
  const need = (cond: unknown, what: string) => assert(cond, `skipped: ${what} failed earlier`);
  /** One life-cycle button on the review page, and the outcome it must report. */
  const act = async (page: Page, button: string, state: string) => {
    await page.getByRole("button", { name: button }).click();
    await page.getByText(`Done: the month is now ${state}`).waitFor({ timeout: 60_000 });
  };
  /** From the statements page, the month's review link, as the officer and signatory find it. */
  const openReviewFromStatements = async (page: Page) => {
    await page.goto(`${k.base}/statements?year=${PERIOD.slice(0, 4)}`);
    await page.getByRole("link", { name: `Review and sign-off, ${site.name}, ${PERIOD_LABEL}` }).click();
    await page.waitForURL(review());
    await page.getByRole("heading", { name: `Review and sign-off: ${PERIOD_LABEL}` }).waitFor();
  };

  const admin = await pageAs("administrator");
  await k.check("journey: administrator sets up a new site through the settings pages", async () => {
    site.id = await setUpSite(k, admin, named);
    await k.shot(admin, "journey-01-site-set-up");
  });
  await k.check("journey: administrator completes the installation identity its statements need", async () => {
    need(site.id, "site set-up");
    await setUpInstallation(k, admin, named);
  });
  let streamsReady = false;
  await k.check("journey: administrator adds its six streams (feed and fuel on one analysis key)", async () => {
    need(site.id, "site set-up");
    await setUpStreams(k, admin, site.id);
    streamsReady = true;
    await k.shot(admin, "journey-02-streams");
  });
  await admin.context().close();

  const engineer = await pageAs("process_engineer");
  let checked = false;
  await k.check("journey: engineer's check step names the one bad row, its column and why", async () => {
    need(streamsReady, "stream set-up");
    await openImport(k, engineer, site);
    await chooseAndCheck(k, engineer, files.bad, "wide");
    await expectBadRowNamed(k, engineer);
    checked = true;
    await k.shot(engineer, "journey-03-import-bad-row");
  });
  let imported = false;
  await k.check("journey: engineer re-uploads the corrected file, checks it clean and imports it", async () => {
    need(checked, "the first check");
    await importClean(k, engineer, files.fixed);
    await k.shot(engineer, "journey-04-import-check-clean");
    await commitImport(k, engineer, basename(files.fixed));
    imported = true;
    await k.shot(engineer, "journey-05-import-done");
  });
  let monthReady = false;
  await k.check("journey: engineer imports the lab analysis and the month page shows the imported totals", async () => {
    need(imported, "the meter import");
    await engineer.getByRole("button", { name: "Import another file" }).click();
    await engineer.getByRole("heading", { name: "Choose the file" }).waitFor();
    await chooseAndCheck(k, engineer, files.lab, "analyses");
    await engineer.getByText("Every row is readable").waitFor();
    await commitImport(k, engineer, basename(files.lab));
    await k.shot(engineer, "journey-06-lab-import-done");
    await expectMonthTotals(k, engineer, site);
    monthReady = true;
    await k.shot(engineer, "journey-07-month-totals");
  });
  let balanced = false;
  await k.check("journey: engineer closes the balance on the review page", async () => {
    need(monthReady, "the month's import");
    await engineer.getByRole("link", { name: "review and sign-off" }).click();
    await engineer.waitForURL(review());
    await engineer.getByText("All three balances close within the site's tolerance.").waitFor();
    await act(engineer, "Close the balance", "Balanced");
    balanced = true;
    await k.shot(engineer, "journey-08-balanced");
  });
  await engineer.context().close();

  const officer = await pageAs("environmental_officer");
  let sent = false;
  await k.check("journey: officer sends the month for sign-off", async () => {
    need(balanced, "the balance");
    await openReviewFromStatements(officer);
    await act(officer, "Send for sign-off", "In review");
    sent = true;
    await k.shot(officer, "journey-09-in-review");
  });
  await k.check("journey: the header's site and month picker follows the review page reached by a link", async () => {
    need(sent, "sending for sign-off");
    // The header stays mounted across client-side navigation; "Open month" must open what is in view.
    const picked = [await officer.getByLabel("Site", { exact: true }).inputValue(), await officer.getByLabel("Month", { exact: true }).inputValue()];
    assert(picked[0] === site.id && picked[1] === PERIOD, `the picker shows ${picked.join(" ")} on the review of ${site.code} ${PERIOD}`);
  });
  await officer.context().close();

  const signatory = await pageAs("signatory");
  let signed = false;
  await k.check("journey: signatory signs the statement", async () => {
    need(sent, "sending for sign-off");
    await openReviewFromStatements(signatory);
    await signatory.waitForLoadState("networkidle");
    await signatory.getByLabel("I have read the statement and I make this declaration.").check();
    const acks = signatory.locator('input[name="acknowledged"]');
    for (let i = 0; i < (await acks.count()); i++) await acks.nth(i).check();
    await act(signatory, "Sign the statement", "Signed");
    await signatory.getByRole("link", { name: /^Download PDF \(rev\. 1\)$/ }).waitFor();
    signed = true;
    await k.shot(signatory, "journey-10-signed");
  });
  await signatory.context().close();

  const auditor = await pageAs("auditor");
  await k.check("journey: auditor downloads the signed PDF from the statements page", async () => {
    need(signed, "signing");
    await auditor.goto(`${k.base}/statements`);
    await auditor.getByRole("heading", { name: "Signed statements" }).waitFor();
    const link = auditor.getByRole("link", { name: `Download ${site.name} ${PERIOD} revision 1` });
    await link.scrollIntoViewIfNeeded();
    await k.shot(auditor, "journey-11-statements");
    const [download] = await Promise.all([auditor.waitForEvent("download"), link.click()]);
    pdfPath = `${k.out}/journey-signed-statement.pdf`;
    await download.saveAs(pdfPath);
    assert(readFileSync(pdfPath).subarray(0, 5).toString() === "%PDF-", "the download is not a PDF");
  });
  await k.check("journey: auditor verifies the download: issued, with the site and period", async () => {
    need(pdfPath, "the download");
    await auditor.goto(`${k.base}/verify`);
    await auditor.waitForLoadState("networkidle");
    await auditor.getByLabel("Statement PDF to verify").setInputFiles(pdfPath);
    await auditor.getByRole("button", { name: "Check the file" }).click();
    const answer = auditor.locator('[data-verdict="issued"]');
    await answer.waitFor({ timeout: 30_000 });
    const text = await answer.innerText();
    assert(text.includes(site.name) && text.includes(`Monthly, ${PERIOD_LABEL}, revision 1`) && text.includes(`JT-${site.code.toUpperCase()}`), `issued answer: ${text.replace(/\s+/g, " ").slice(0, 300)}`);
    await k.shot(auditor, "journey-12-verify-issued");
  });
  await k.check("journey: a copy with one signed byte changed is refused as altered", async () => {
    need(pdfPath, "the download");
    const { bytes } = tamperSignedByte(readFileSync(pdfPath), site.name);
    await auditor.getByLabel("Statement PDF to verify").setInputFiles({ name: "journey-tampered.pdf", mimeType: "application/pdf", buffer: bytes });
    await auditor.getByRole("button", { name: "Check the file" }).click();
    const answer = auditor.locator('[data-verdict="altered"]');
    await answer.waitFor({ timeout: 30_000 });
    const text = await answer.innerText();
    assert(/content was changed after signing/.test(text), `altered answer gives no reason: ${text.replace(/\s+/g, " ").slice(0, 300)}`);
    assert(text.includes(site.name), "the altered answer does not name the statement it claims to be");
    await k.shot(auditor, "journey-13-verify-altered");
  });
  await auditor.context().close();
}
