/**
 * Browser test of the foundation screens, run with `npm run test:e2e` against a running app
 * (E2E_BASE_URL, default http://127.0.0.1:3000; `npm start` serves one). Drives Debian's
 * Chromium through playwright-core. Screenshots go to test-results/e2e/.
 * The last line is always `e2e: N passed, M failed`; any failure exits non-zero.
 */
import { mkdirSync } from "node:fs";
import { randomBytes } from "node:crypto";
import { chromium, type Browser, type Page } from "playwright-core";
import { DEMO_USERS } from "../../db/demo-users";
import { runMonthEntry } from "./month-entry";
import { overviewChecks } from "./overview";
import { securityChecks } from "./security";
import { lifecycleChecks } from "./lifecycle";
import { journeyChecks } from "./journey";
import { widthChecks } from "./widths";
import { embeddedEmissionsChecks } from "./embedded-emissions";
import { onboardingChecks } from "./onboarding";
import { instanceChecks } from "./instances";

const BASE = (process.env.E2E_BASE_URL ?? "http://127.0.0.1:3000").replace(/\/+$/, "");
const OUT = "test-results/e2e";
const CHROMIUM = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";

const admin = DEMO_USERS.find((u) => u.roles.includes("administrator"))!;
const auditor = DEMO_USERS.find((u) => u.roles.includes("auditor"))!;

let passed = 0;
let failed = 0;

async function check(name: string, fn: () => Promise<void>): Promise<void> {
  try {
    await fn();
    passed++;
    console.log(`ok    ${name}`);
  } catch (err) {
    failed++;
    console.log(`FAIL  ${name}\n      ${err instanceof Error ? err.message.split("\n")[0] : String(err)}`);
  }
}

function assert(cond: unknown, message: string): asserts cond {
  if (!cond) throw new Error(message);
}

async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: `${OUT}/${name}.png`, fullPage: true });
}

async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto(`${BASE}/sign-in`);
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

async function navLinks(page: Page): Promise<string[]> {
  return page.getByRole("navigation", { name: "Main" }).getByRole("link").allInnerTexts();
}

async function main(): Promise<void> {
  mkdirSync(OUT, { recursive: true });
  let browser: Browser | null = null;
  try {
    browser = await chromium.launch({
      executablePath: CHROMIUM,
      args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run"],
    });
  } catch (err) {
    failed++;
    console.log(`FAIL  launch Chromium at ${CHROMIUM} (apt-get install -y chromium)\n      ${err instanceof Error ? err.message.split("\n")[0] : err}`);
    return;
  }
  const viewport = { width: 1280, height: 860 };

  try {
    // Signed-out visitor.
    const anon = await (await browser.newContext({ viewport })).newPage();
    await check("signed-out visitor is sent to the sign-in page", async () => {
      await anon.goto(`${BASE}/settings/users`);
      await anon.waitForURL(/\/sign-in/);
      assert(await anon.getByText("Synledger").first().isVisible(), "product name missing");
      await shot(anon, "01-sign-in");
    });
    await check("a wrong password shows the shared refusal message", async () => {
      // A fresh unknown address each run, so repeated runs never lock a demo account; unknown
      // addresses and wrong passwords get the same message by design.
      await signIn(anon, `nobody-${randomBytes(4).toString("hex")}@vellmar.example`, "Wrong#Password2026");
      // By id: Next.js has its own role="alert" element (the route announcer).
      const alert = anon.locator("#sign-in-message");
      await alert.waitFor({ timeout: 15_000 });
      const text = await alert.innerText();
      assert(/do not match an account/.test(text), `unexpected message: ${text}`);
      assert(anon.url().includes("/sign-in"), "left the sign-in page");
      await shot(anon, "02-sign-in-wrong-password");
    });
    await check("an empty form names the missing fields", async () => {
      await anon.goto(`${BASE}/sign-in`);
      await anon.getByRole("button", { name: "Sign in" }).click();
      await anon.getByText("Enter your e-mail address.").waitFor({ timeout: 10_000 });
      assert(await anon.getByText("Enter your password.").isVisible(), "password error missing");
    });

    // Administrator.
    const adminPage = await (await browser.newContext({ viewport })).newPage();
    await check("administrator signs in and sees the overview", async () => {
      await signIn(adminPage, admin.email, admin.password);
      await adminPage.waitForURL(`${BASE}/`, { timeout: 20_000 });
      await adminPage.getByRole("heading", { name: "Overview" }).waitFor();
      assert(await adminPage.getByText(admin.name).first().isVisible(), "user name missing from header");
      assert(await adminPage.getByText("Administrator").first().isVisible(), "role label missing from header");
      await shot(adminPage, "03-admin-overview");
    });
    await check("administrator sees Settings in the navigation and opens users", async () => {
      const links = await navLinks(adminPage);
      assert(links.includes("Settings"), `navigation: ${links.join(", ")}`);
      await adminPage.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Settings" }).click();
      await adminPage.waitForURL(/\/settings\/users$/);
      await adminPage.getByRole("heading", { name: /Members of/ }).waitFor();
      assert(await adminPage.getByText(auditor.email).isVisible(), "auditor not listed among members");
      assert(await adminPage.getByRole("button", { name: "Send invitation" }).isVisible(), "invite form missing");
      await shot(adminPage, "04-admin-users");
    });
    await check("inviting with no role is refused with a field message", async () => {
      await adminPage.getByLabel("E-mail address").fill(`someone-${randomBytes(3).toString("hex")}@vellmar.example`);
      await adminPage.getByRole("button", { name: "Send invitation" }).click();
      await adminPage.getByText("Choose at least one role.").waitFor({ timeout: 10_000 });
    });
    await check("a site id outside the organisation gives not found", async () => {
      await adminPage.goto(`${BASE}/sites/00000000-0000-4000-8000-000000000000/months/2026-01`);
      await adminPage.getByRole("heading", { name: "Not found" }).waitFor();
      await shot(adminPage, "05-not-found");
    });

    // Auditor.
    const auditorPage = await (await browser.newContext({ viewport })).newPage();
    await check("auditor signs in and does not see Settings", async () => {
      await signIn(auditorPage, auditor.email, auditor.password);
      await auditorPage.waitForURL(`${BASE}/`, { timeout: 20_000 });
      await auditorPage.getByRole("heading", { name: "Overview" }).waitFor();
      const links = await navLinks(auditorPage);
      assert(!links.includes("Settings"), `auditor sees: ${links.join(", ")}`);
      assert(await auditorPage.getByText("Auditor").first().isVisible(), "role label missing");
      await shot(auditorPage, "06-auditor-overview");
    });
    await check("auditor opening the users page directly gets the forbidden page", async () => {
      await auditorPage.goto(`${BASE}/settings/users`);
      await auditorPage.waitForURL(/\/forbidden\?need=org%3Amanage-users/);
      await auditorPage.getByRole("heading", { name: "Your role does not allow this page" }).waitFor();
      assert(await auditorPage.getByText("Administrator", { exact: true }).isVisible(), "needed role not named");
      await shot(auditorPage, "07-auditor-forbidden");
    });
    await check("auditor can read the audit trail", async () => {
      await auditorPage.goto(`${BASE}/audit`);
      await auditorPage.getByRole("heading", { name: "Audit trail" }).waitFor();
      await shot(auditorPage, "08-auditor-audit");
    });
    await check("signing out returns to the sign-in page", async () => {
      // The overview streams its cards in; click once they have arrived, as a person would.
      await auditorPage.goto(`${BASE}/`, { waitUntil: "networkidle" });
      await auditorPage.getByRole("button", { name: "Sign out" }).click();
      await auditorPage.waitForURL(/\/sign-in/, { timeout: 60_000 });
      await auditorPage.goto(`${BASE}/audit`);
      await auditorPage.waitForURL(/\/sign-in/);
    });

    await lifecycleChecks({ browser, base: BASE, out: OUT, viewport, check, assert, shot, signIn });

    await runMonthEntry(browser, { base: BASE, viewport, check, assert, shot, signIn });

    await overviewChecks({ browser, base: BASE, viewport, check, assert, shot, signIn });
    await embeddedEmissionsChecks({ browser, base: BASE, out: OUT, viewport, check, assert, shot, signIn });
    await onboardingChecks({ browser, base: BASE, out: OUT, viewport, check, assert, shot, signIn });

    await journeyChecks({ browser, base: BASE, out: OUT, viewport, check, assert, shot, signIn });

    await widthChecks(browser, { base: BASE, out: OUT, viewport, check, assert, shot, signIn });

    await securityChecks({ browser, base: BASE, check, assert });

    // Last: it leaves five of the demo's Open months Balanced (the other checks need them Open).
    await instanceChecks({ browser, base: BASE, out: OUT, viewport, check, assert, shot, signIn });
  } finally {
    await browser.close();
  }
}

main()
  .catch((err) => {
    failed++;
    console.log(`FAIL  unexpected error: ${err instanceof Error ? err.message : String(err)}`);
  })
  .finally(() => {
    console.log(`e2e: ${passed} passed, ${failed} failed`);
    process.exitCode = failed > 0 ? 1 : 0;
  });
