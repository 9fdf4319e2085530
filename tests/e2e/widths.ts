/**
 * Every main page at phone width (390 px) and desk width (1440 px), called from run.ts (issue
 * 17): no horizontal scroll, every input at least 120 px wide on the phone, a figure typed and
 * saved by keyboard on the phone, and an accessibility check (axe-core, run in the page) with no
 * serious or critical violation. Screenshots of each page at both widths: widths-<page>-<w>.png.
 */
import { createRequire } from "node:module";
import type { Browser, Page } from "playwright-core";
import { DEMO_USERS } from "../../db/demo-users";
import type { E2eKit } from "./month-entry";

const require = createRequire(import.meta.url);
const AXE = require.resolve("axe-core/axe.min.js");

const engineer = DEMO_USERS.find((u) => u.roles.includes("process_engineer"))!;

interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: string[]; html: string }[];
}

async function axeProblems(page: Page): Promise<string[]> {
  await page.addScriptTag({ path: AXE });
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<{ violations: AxeViolation[] }> } }).axe;
    const r = await axe.run(document, { resultTypes: ["violations"] });
    return r.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.slice(0, 3).map((n) => ({ target: n.target, html: n.html.slice(0, 160) })) }));
  });
  return violations.filter((v) => v.impact === "serious" || v.impact === "critical").map((v) => `${v.id} (${v.impact}): ${v.help} at ${v.nodes.map((n) => `${n.target.join(" ")} ${n.html}`).join(", ")}`);
}

/** Wider than the window: the page itself would scroll sideways. */
const overflow = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);

/** The outermost elements that reach past the window's right edge, for the failure message. */
const overflowing = (page: Page) =>
  page.evaluate(() => {
    const w = window.innerWidth;
    const wide = [...document.querySelectorAll<HTMLElement>("body *")].filter((el) => el.getBoundingClientRect().right > w + 1);
    return wide
      .filter((el) => !wide.includes(el.parentElement as HTMLElement))
      .slice(0, 4)
      .map((el) => `${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ""}.${[...el.classList].slice(0, 3).join(".")} (${Math.round(el.getBoundingClientRect().right)} px)`);
  });

/** Visible fields narrower than 120 px (checkboxes, radios and the like excluded). */
const narrowFields = (page: Page) =>
  page.evaluate(() =>
    [...document.querySelectorAll<HTMLElement>("main input, main select, main textarea")]
      .filter((el) => {
        const t = (el as HTMLInputElement).type;
        if (["checkbox", "radio", "hidden", "submit", "button"].includes(t)) return false;
        const r = el.getBoundingClientRect();
        return r.width > 0 && r.height > 0 && r.width < 120;
      })
      .map((el) => `${el.id || el.getAttribute("name") || el.tagName} ${Math.round(el.getBoundingClientRect().width)} px`),
  );

export async function widthChecks(browser: Browser, kit: E2eKit & { out: string }): Promise<void> {
  const assert: E2eKit["assert"] = (cond, message) => kit.assert(cond, message);
  const phone = await (await browser.newContext({ viewport: { width: 390, height: 844 } })).newPage();
  const desk = await (await browser.newContext({ viewport: { width: 1440, height: 900 } })).newPage();
  phone.setDefaultTimeout(60_000);
  desk.setDefaultTimeout(60_000);
  for (const p of [phone, desk]) {
    await kit.signIn(p, engineer.email, engineer.password);
    await p.waitForURL((u) => !u.pathname.startsWith("/sign-in"), { timeout: 20_000 });
  }
  const siteId = await desk.locator("#ctx-site option", { hasText: "Estuary Works" }).getAttribute("value");
  assert(siteId, "no Estuary Works in the picker");
  // An open month that has ended (the demo's Open months are May onwards).
  const month = "2026-06";
  const pages: [string, string, string][] = [
    ["overview", "/", "Overview"],
    ["ledger", "/months", "Monthly ledger"],
    ["month", `/sites/${siteId}/months/${month}`, "June 2026"],
    ["review", `/sites/${siteId}/months/${month}/review`, "Review and sign-off"],
    ["year", `/sites/${siteId}/years/2026`, "Year 2026"],
    ["trends", `/sites/${siteId}/trends`, "Trends"],
    ["audit", "/audit", "Audit trail"],
    ["statements", "/statements", "Statements"],
    ["account", "/account", "Your account"],
  ];

  for (const [name, path, heading] of pages) {
    await kit.check(`widths: ${name} at 390 px has no horizontal scroll and no field under 120 px; at 1440 px too`, async () => {
      for (const [p, w] of [[phone, 390], [desk, 1440]] as const) {
        await p.goto(`${kit.base}${path}`);
        await p.getByRole("heading", { name: heading }).first().waitFor();
        await p.waitForLoadState("networkidle");
        await p.screenshot({ path: `${kit.out}/widths-${name}-${w}.png`, fullPage: true });
        const extra = await overflow(p);
        assert(extra <= 0, `${name} at ${w} px scrolls sideways by ${extra} px: ${(await overflowing(p)).join(", ")}`);
        if (w === 390) {
          const narrow = await narrowFields(p);
          assert(narrow.length === 0, `${name} at 390 px: fields under 120 px: ${narrow.join(", ")}`);
        }
      }
    });
    await kit.check(`widths: ${name} has no serious or critical accessibility violation (axe-core)`, async () => {
      const problems = [...(await axeProblems(desk)), ...(await axeProblems(phone)).map((p) => `390 px: ${p}`)];
      assert(problems.length === 0, problems.join(" | "));
    });
  }

  await kit.check("widths: on the phone a figure is typed and saved with the keyboard: one change", async () => {
    await phone.goto(`${kit.base}/sites/${siteId}/months/${month}`);
    await phone.locator("form[data-interactive]").waitFor();
    const nh3 = phone.getByLabel("Ammonia produced", { exact: true });
    const was = await nh3.inputValue();
    const next = (Number(was) + 0.5).toFixed(1);
    await nh3.focus();
    await phone.keyboard.press("Control+A");
    await phone.keyboard.type(next);
    await phone.keyboard.press("Control+s");
    await phone.getByText("Saved 1 change.").waitFor({ timeout: 30_000 });
    await phone.screenshot({ path: `${kit.out}/widths-month-saved-390.png`, fullPage: true });
  });
}
