/**
 * Browser test of onboarding (issue 19), called from run.ts: `npm run org:create` makes a new
 * organisation and prints a one-time link; the first administrator opens it, chooses a name and a
 * password, signs in and lands in the new, empty organisation with the administrator's settings.
 * The same link then says it has been used. Needs DATABASE_URL and APP_URL as npm test sets them.
 */
import { spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import type { E2eKit } from "./lifecycle";

export async function onboardingChecks(k: E2eKit): Promise<void> {
  const tag = randomBytes(3).toString("hex");
  const email = `founder-${tag}@tarnbeck.example`;
  const password = `Tarnbeck#${tag}2026`;
  let link = "";
  await k.check("org:create prints a one-time invitation link for the first administrator", async () => {
    const r = spawnSync("node", ["--import", "./scripts/allow-server-modules.mjs", "--import", "tsx", "scripts/org-create.ts", "--name", `Tarnbeck Ammonia ${tag}`, "--admin-email", email],
      { encoding: "utf8", env: { ...process.env, APP_URL: k.base } });
    k.assert(r.status === 0, `org:create exited ${r.status}: ${r.stderr}`);
    link = r.stdout.split("\n").find((l) => l.includes("/invitations/"))?.trim() ?? "";
    k.assert(link.startsWith(`${k.base}/invitations/`), `no link in: ${r.stdout}`);
    const bad = spawnSync("node", ["--import", "./scripts/allow-server-modules.mjs", "--import", "tsx", "scripts/org-create.ts", "--name", "X", "--admin-email", "not-an-address"], { encoding: "utf8" });
    k.assert(bad.status === 2 && /--name|--admin-email/.test(bad.stderr), `bad input not refused with the field named: ${bad.stderr}`);
  });

  await k.check("the first administrator accepts the link, signs in and sees the new organisation", async () => {
    const page = await (await k.browser.newContext({ viewport: k.viewport })).newPage();
    page.setDefaultTimeout(60_000);
    await page.goto(link);
    await page.getByLabel("Your name").fill("Ines Haldane");
    await page.getByLabel("Choose a password").fill(password);
    await page.getByLabel("Type the password again").fill(password);
    await page.getByRole("button").filter({ hasText: /account|join|accept/i }).first().click();
    await page.waitForURL(/\/sign-in/);
    await k.signIn(page, email, password);
    await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"), { timeout: 30_000 });
    const text = await page.locator("body").innerText();
    k.assert(text.includes(`Tarnbeck Ammonia ${tag}`), "the new organisation's name is not shown");
    await k.shot(page, "onboarding-01-first-admin");
    await page.goto(link);
    const again = await page.locator("main").innerText();
    k.assert(/used|accepted/i.test(again), `the used link does not say so: ${again.slice(0, 200)}`);
    await page.context().close();
  });
}
