/**
 * Browser test of review and sign-off, called from run.ts: the engineer balances an Open month of
 * the demo's Estuary site, the officer sends it for sign-off, the signatory reads the preview,
 * makes the declaration and signs, the PDF downloads, and a browser without an account verifies
 * it (issued) and a tampered copy (altered). Re-runnable:
 * when no Open month is left, the officer first reopens a signed one.
 */
import { readFileSync } from "node:fs";
import type { Browser, Page } from "playwright-core";
import { DEMO_USERS } from "../../db/demo-users";

export interface E2eKit {
  browser: Browser;
  base: string;
  out: string;
  viewport: { width: number; height: number };
  check: (name: string, fn: () => Promise<void>) => Promise<void>;
  assert: (cond: unknown, message: string) => asserts cond;
  shot: (page: Page, name: string) => Promise<void>;
  signIn: (page: Page, email: string, password: string) => Promise<void>;
}

const user = (role: string) => DEMO_USERS.find((u) => u.roles.includes(role as never))!;
const SITE = "Estuary Works";

/** A page signed in as the demo user holding `role`, downloads allowed, at the kit's viewport or `width`. */
export async function pageAsRole(k: E2eKit, role: string, width = k.viewport.width) {
  const page = await (await k.browser.newContext({ viewport: { width, height: k.viewport.height }, acceptDownloads: true })).newPage();
  // The review page runs the engine on the stored month; a cold development server compiles first.
  page.setDefaultTimeout(60_000);
  page.setDefaultNavigationTimeout(90_000);
  const u = user(role);
  await k.signIn(page, u.email, u.password);
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"), { timeout: 20_000 });
  return page;
}

export async function lifecycleChecks(k: E2eKit): Promise<void> {
  const assert: E2eKit["assert"] = k.assert;
  const pageAs = (role: string) => pageAsRole(k, role);
  const act = async (page: Page, button: string, state: string) => {
    await page.getByRole("button", { name: button }).click();
    await page.getByText(`Done: the month is now ${state}`).waitFor({ timeout: 60_000 });
  };
  const now = new Date();
  const monthName = (d: Date) => d.toLocaleDateString("en-GB", { month: "long", year: "numeric", timeZone: "UTC" });
  const running = monthName(now);
  /** A month of Estuary in the given state, by its review link (August is the drift month; the running month cannot be closed yet). */
  const monthIn = async (page: Page, state: string): Promise<string | null> => {
    await page.goto(`${k.base}/statements?year=2026`);
    const block = page.locator("div", { has: page.getByRole("heading", { name: new RegExp(SITE) }) }).last();
    const items = block.locator("li", { hasText: state });
    for (let i = 0; i < (await items.count()); i++) {
      const a = items.nth(i).getByRole("link");
      const label = (await a.getAttribute("aria-label")) ?? "";
      if (!label.includes("August") && !label.includes(running)) return (await a.getAttribute("href"))!;
    }
    return null;
  };

  let review = "";
  let pdfPath = "";
  const engineer = await pageAs("process_engineer");
  const officer = await pageAs("environmental_officer");

  await k.check("engineer closes the balance of an Open month within tolerance", async () => {
    let href = await monthIn(engineer, "Open");
    if (!href) {
      href = await monthIn(officer, "Signed");
      assert(href, "no Open and no Signed month of Estuary left");
      await officer.goto(`${k.base}${href}`);
      await officer.getByLabel("Reason").fill("Browser test: reopened to exercise the life cycle again.");
      await act(officer, "Reopen", "Open");
    }
    review = `${k.base}${href}`;
    await engineer.goto(review);
    await engineer.getByRole("heading", { name: /Review and sign-off/ }).first().waitFor();
    assert(await engineer.getByText("All three balances close within the site's tolerance.").isVisible(), "tolerance precondition not shown");
    await act(engineer, "Close the balance", "Balanced");
  });

  await k.check("officer chooses the month's method, factor set and GWP set on the review page", async () => {
    await officer.goto(review);
    const panel = officer.getByRole("region", { name: "Method of this month" });
    await panel.getByLabel("Factor set").selectOption("eu-mrr");
    await panel.getByLabel("GWP set").selectOption("AR5");
    await panel.getByRole("button", { name: "Save the method" }).click();
    await panel.getByText("Saved: the month is computed with the new choice.").waitFor({ timeout: 30_000 });
    await officer.reload();
    const chosen = await officer.getByRole("region", { name: "Method of this month" }).innerText();
    assert(chosen.includes("EU ETS Monitoring and Reporting Regulation") && chosen.includes("eu-mrr"), `chosen: ${chosen.slice(0, 200)}`);
    await k.shot(officer, "19-review-method");
  });

  await k.check("officer sends it for sign-off; the page then reads the frozen record", async () => {
    await officer.goto(review);
    assert(!(await officer.getByRole("button", { name: "Close the balance" }).count()), "officer offered the engineer's action");
    await act(officer, "Send for sign-off", "In review");
    await officer.getByText(/Frozen record of revision \d+/).waitFor();
    const panel = await officer.getByRole("region", { name: "Method of this month" }).innerText();
    assert(panel.includes("Frozen with revision") && !(await officer.getByRole("button", { name: "Save the method" }).count()), "method still editable after freezing");
  });

  await k.check("the running month says it is in progress and cannot be closed; the next month is read-only", async () => {
    const key = (d: Date) => `${d.getUTCFullYear()}-${String(d.getUTCMonth() + 1).padStart(2, "0")}`;
    const siteHref = review.replace(/\/months\/.*$/, "");
    await engineer.goto(`${siteHref}/months/${key(now)}`);
    await engineer.getByText(`In progress: day ${now.getUTCDate()} of`).waitFor();
    const next = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() + 1, 1));
    await engineer.goto(`${siteHref}/months/${key(next)}`);
    await engineer.getByText(`${monthName(next)} has not begun`).waitFor();
    assert((await engineer.locator("main input").count()) === 0, "the next month's page offers fields to fill");
    await k.shot(engineer, "18-next-month-read-only");
  });

  const signatory = await pageAs("signatory");
  await k.check("signatory opens the preview, ticks the declaration and each unconfirmed value, signs, sees it seal, then the signed state", async () => {
    await signatory.goto(review);
    await signatory.waitForLoadState("networkidle");
    // The preview is the unsigned PDF as it will be signed.
    const preview = signatory.getByRole("link", { name: "Open the statement as it will be signed (PDF)" });
    const res = await signatory.request.get(`${k.base}${await preview.getAttribute("href")}`);
    assert(res.status() === 200 && res.headers()["content-type"] === "application/pdf", `preview answered ${res.status()}`);
    assert((await res.body()).subarray(0, 5).toString() === "%PDF-", "preview is not a PDF");
    const [popup] = await Promise.all([signatory.waitForEvent("popup"), preview.click()]);
    await popup.close();
    const sign = signatory.getByRole("button", { name: "Sign the statement" });
    assert(await sign.isDisabled(), "the sign button works before the declaration is ticked");
    await signatory.getByLabel("I have read the statement and I make this declaration.").check();
    const acks = signatory.locator('input[name="acknowledged"]');
    const n = await acks.count();
    for (let i = 0; i < n; i++) await acks.nth(i).check();
    assert(await sign.isEnabled(), "the sign button stays disabled with every box ticked");
    await k.shot(signatory, "19-sign-ready");
    await sign.click();
    await signatory.getByRole("status").filter({ has: signatory.locator("progress") }).waitFor({ timeout: 10_000 });
    await k.shot(signatory, "19b-sign-progress");
    await signatory.getByText("Done: the month is now Signed").waitFor({ timeout: 60_000 });
    await signatory.reload();
    await k.shot(signatory, "20-review-signed");
    const link = signatory.getByRole("link", { name: /^Download PDF \(rev\. \d+\)$/ }).last();
    const [download] = await Promise.all([signatory.waitForEvent("download"), link.click()]);
    pdfPath = `${k.out}/signed-statement.pdf`;
    await download.saveAs(pdfPath);
    assert(readFileSync(pdfPath).subarray(0, 5).toString() === "%PDF-", "download is not a PDF");
  });

  const member = await pageAs("auditor");
  await k.check("the auditor sees the statement listed", async () => {
    await member.goto(`${k.base}/statements`);
    await member.getByRole("heading", { name: "Signed statements" }).waitFor();
    await k.shot(member, "21-statements");
  });

  // Verification is public: a browser that never signed in checks the download.
  const auditor = await (await k.browser.newContext({ viewport: k.viewport })).newPage();
  auditor.setDefaultTimeout(60_000);
  await k.check("an anonymous browser verifies the download: issued, with the installation named, then its public record", async () => {
    await auditor.goto(`${k.base}/verify`);
    // The drop zone is a client component: give it time to hydrate before handing it a file.
    await auditor.waitForLoadState("networkidle");
    await auditor.getByLabel("Statement PDF to verify").setInputFiles(pdfPath);
    await auditor.getByRole("button", { name: "Check the file" }).click();
    const answer = auditor.locator('[data-verdict="issued"]');
    await answer.waitFor({ timeout: 30_000 });
    const said = await answer.innerText();
    assert(said.includes(SITE) && said.includes("Vellmar Nitrogen Company Limited"), "issued answer does not name the installation and operator");
    assert(!auditor.url().includes("/sign-in"), "the verify page sent an anonymous visitor to sign in");
    await k.shot(auditor, "22-verify-issued");
    await answer.getByRole("link").filter({ hasText: /^[0-9a-f-]{36}$/ }).first().click();
    await auditor.getByText(/is the latest revision of this period/).waitFor();
    await k.shot(auditor, "22b-verify-record");
    await auditor.goBack();
  });

  await k.check("a tampered copy is refused as altered", async () => {
    const bytes = readFileSync(pdfPath);
    const at = bytes.indexOf(SITE);
    assert(at > 0, "site name not found in the PDF bytes");
    bytes[at] = "F".charCodeAt(0);
    await auditor.getByLabel("Statement PDF to verify").setInputFiles({ name: "tampered.pdf", mimeType: "application/pdf", buffer: bytes });
    await auditor.getByRole("button", { name: "Check the file" }).click();
    await auditor.locator('[data-verdict="altered"]').waitFor({ timeout: 30_000 });
    await k.shot(auditor, "23-verify-altered");
  });
}
