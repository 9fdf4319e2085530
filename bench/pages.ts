/**
 * Page speed in a real browser: each main page of the production build, signed in as the bench
 * fleet's engineer (50 sites), timed from navigation start to its main content being visible
 * and the page interactive (hydrated). Median and spread of 5 loads after one warm-up.
 */
import { chromium, type Page } from "playwright-core";

export interface PageFigure {
  label: string;
  path: string;
  medianMs: number;
  minMs: number;
  maxMs: number;
  /** Set when the page did not get ready within the timeout: the figures are then not measured. */
  failed?: string;
}

const CHROMIUM = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";
const RUNS = 5;

/** What "ready" means for each page: its main content is on screen and its controls respond. */
export interface PageTarget {
  label: string;
  path: string;
  ready: (page: Page) => Promise<unknown>;
}

export async function timePages(base: string, email: string, password: string, targets: PageTarget[]): Promise<PageFigure[]> {
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    timeout: 60_000,
    args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run"],
  });
  try {
    const page = await (await browser.newContext({ viewport: { width: 1440, height: 900 } })).newPage();
    page.setDefaultTimeout(60_000);
    await page.goto(`${base}/sign-in`);
    await page.getByLabel("E-mail address").fill(email);
    await page.getByLabel("Password").fill(password);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
    const out: PageFigure[] = [];
    for (const t of targets) {
      console.log(`[bench] timing page ${t.label} (${t.path})`);
      const times: number[] = [];
      try {
        for (let i = 0; i <= RUNS; i++) {
          const started = Date.now();
          await page.goto(`${base}${t.path}`, { waitUntil: "commit" });
          await t.ready(page);
          // The first load warms the server's caches and the browser's; it is not counted.
          if (i > 0) times.push(Date.now() - started);
        }
      } catch (err) {
        // A page too slow at this scale is a figure too: it is reported, and the bench goes on.
        out.push({ label: t.label, path: t.path, medianMs: 0, minMs: 0, maxMs: 0, failed: `not ready within 60 s (${err instanceof Error ? err.message.split("\n")[0] : String(err)})` });
        continue;
      }
      times.sort((a, b) => a - b);
      out.push({ label: t.label, path: t.path, medianMs: times[Math.floor(times.length / 2)], minMs: times[0], maxMs: times[times.length - 1] });
    }
    return out;
  } finally {
    await browser.close();
  }
}
