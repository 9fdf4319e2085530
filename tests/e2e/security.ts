/**
 * Security checks against the running app, called from run.ts: security headers on pages, API
 * answers, redirects, errors and static files; the session cookie's flags over HTTP and behind
 * an HTTPS proxy; the cross-site refusal of cookie-authenticated API mutations; and the sign-in
 * rate limit, through Auth.js's endpoint and through the form. Uses fetch for everything except
 * the form. Every attempt comes from its own made-up client address (X-Forwarded-For, which the
 * test app trusts), so the per-address limit of the other browser tests is left untouched.
 */
import { randomBytes } from "node:crypto";
import { readFileSync } from "node:fs";
import type { Browser } from "playwright-core";
import { DEMO_USERS } from "../../db/demo-users";

export interface SecurityKit {
  browser: Browser;
  base: string;
  check: (name: string, fn: () => Promise<void>) => Promise<void>;
  assert: (cond: unknown, message: string) => asserts cond;
}

const EVIL = "https://evil.example";
const auditor = DEMO_USERS.find((u) => u.roles.includes("auditor"))!;
const fakeIp = () => `198.51.100.${1 + (randomBytes(1)[0] % 250)}, 10.${randomBytes(1)[0]}.${randomBytes(1)[0]}.${randomBytes(1)[0]}`;

/**
 * The Cookie header a browser would send next (a later Set-Cookie of the same name wins: the
 * proxy and the route handler may each set a csrf cookie), and the raw lines for their flags.
 */
function cookiesOf(res: Response): { jar: string; lines: string[] } {
  const lines = res.headers.getSetCookie();
  const jar = new Map(lines.map((l) => l.split(";")[0].split(/=(.*)/s) as [string, string]));
  return { jar: [...jar].map(([k, v]) => `${k}=${v}`).join("; "), lines };
}

/** Signs in through Auth.js's own endpoints (csrf token, then the credentials callback). */
async function credentialsCallback(base: string, email: string, password: string, extra: Record<string, string> = {}) {
  const csrfRes = await fetch(`${base}/api/auth/csrf`, { headers: extra });
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const csrfCookies = cookiesOf(csrfRes).jar;
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { ...extra, "content-type": "application/x-www-form-urlencoded", cookie: csrfCookies, origin: base },
    body: new URLSearchParams({ csrfToken, email, password, callbackUrl: `${base}/` }),
  });
  return { res, location: res.headers.get("location") ?? "", ...cookiesOf(res) };
}

function headerProblems(url: string, res: Response): string[] {
  const h = res.headers;
  const csp = h.get("content-security-policy") ?? "";
  const problems: string[] = [];
  if (!/frame-ancestors 'none'/.test(csp)) problems.push(`${url}: CSP without frame-ancestors 'none' (${csp || "none"})`);
  if (!/default-src 'self'|default-src 'none'/.test(csp)) problems.push(`${url}: CSP without a default-src`);
  if (h.get("x-content-type-options") !== "nosniff") problems.push(`${url}: no nosniff`);
  if (h.get("referrer-policy") !== "strict-origin-when-cross-origin") problems.push(`${url}: referrer policy ${h.get("referrer-policy")}`);
  if (h.get("x-frame-options") !== "DENY") problems.push(`${url}: X-Frame-Options ${h.get("x-frame-options")}`);
  if (h.get("x-powered-by")) problems.push(`${url}: X-Powered-By ${h.get("x-powered-by")}`);
  return problems;
}

export async function securityChecks(k: SecurityKit): Promise<void> {
  const { base, check } = k;
  // An assertion function must be reached through an explicitly typed name (TS2775).
  const assert: (cond: unknown, message: string) => asserts cond = k.assert;
  let session = "";

  await check("security: signing in through Auth.js sets an HttpOnly, SameSite=Lax session cookie (not Secure over plain HTTP)", async () => {
    const r = await credentialsCallback(base, auditor.email, auditor.password, { "x-forwarded-for": fakeIp() });
    const line = r.lines.find((l) => l.startsWith("authjs.session-token="));
    assert(line, `no session cookie; status ${r.res.status}, location ${r.location}, cookies ${r.lines.map((l) => l.split("=")[0]).join(", ")}`);
    assert(/;\s*HttpOnly/i.test(line), `not HttpOnly: ${line.replace(/=[^;]+/, "=…")}`);
    assert(/;\s*SameSite=Lax/i.test(line), `not SameSite=Lax: ${line.replace(/=[^;]+/, "=…")}`);
    assert(!/;\s*Secure/i.test(line), "Secure over plain HTTP would make the cookie unusable");
    session = r.jar;
  });

  await check("security: behind an HTTPS proxy the session cookie is __Secure- prefixed and Secure", async () => {
    const https = { "x-forwarded-proto": "https", "x-forwarded-for": fakeIp() };
    const r = await credentialsCallback(base, auditor.email, auditor.password, https);
    const line = r.lines.find((l) => l.startsWith("__Secure-authjs.session-token="));
    assert(line, `no __Secure- session cookie; got ${r.lines.map((l) => l.split("=")[0]).join(", ") || "none"} (status ${r.res.status})`);
    assert(/;\s*Secure/i.test(line) && /;\s*HttpOnly/i.test(line) && /;\s*SameSite=Lax/i.test(line), `flags: ${line.replace(/=[^;]+/, "=…")}`);
  });

  await check("security: CSP, frame-ancestors, nosniff and referrer policy on pages, redirects, errors, API answers and static files", async () => {
    const signIn = await fetch(`${base}/sign-in`);
    const html = await signIn.text();
    const asset = /<script[^>]+src="(\/_next\/static\/[^"]+)"/.exec(html)?.[1];
    assert(asset, "no static script found on the sign-in page");
    const urls: [string, Record<string, string>][] = [
      ["/sign-in", {}],
      ["/", {}],
      ["/", { cookie: session }],
      ["/audit", { cookie: session }],
      ["/no-such-page-here", { cookie: session }],
      [asset, {}],
      ["/api/v1/health", {}],
      ["/api/v1/sites", {}],
      ["/api/v1/sites", { cookie: session }],
      ["/api/v1/openapi.json", {}],
      ["/api/auth/csrf", {}],
      ["/api/auth/session", { cookie: session }],
    ];
    const problems = [...headerProblems("/sign-in (first)", signIn)];
    for (const [path, headers] of urls) {
      const res = await fetch(`${base}${path}`, { headers, redirect: "manual" });
      await res.arrayBuffer();
      problems.push(...headerProblems(`${path}${headers.cookie ? " (signed in)" : ""} ${res.status}`, res));
    }
    assert(problems.length === 0, problems.join("; "));
  });

  await check("security: a cookie-authenticated API mutation from another site is refused (403), from the app's own origin it runs", async () => {
    const body = readFileSync("examples/estuary-2026-03.json", "utf8");
    const post = (headers: Record<string, string>) =>
      fetch(`${base}/api/v1/calculate`, { method: "POST", body, headers: { cookie: session, "content-type": "application/json", ...headers } });
    const crossSite: Record<string, string>[] = [{ origin: EVIL }, { "sec-fetch-site": "cross-site" }, { origin: "null" }];
    for (const headers of crossSite) {
      const res = await post(headers);
      const json = (await res.json()) as { error?: { code?: string; message?: string } };
      assert(res.status === 403 && json.error?.code === "cross_site_request", `${JSON.stringify(headers)} → ${res.status} ${JSON.stringify(json).slice(0, 120)}`);
      assert(/another site/.test(json.error?.message ?? ""), "the refusal does not say why");
    }
    const own = await post({ origin: new URL(base).origin, "sec-fetch-site": "same-origin" });
    assert(own.status === 200, `same-origin POST → ${own.status}`);
  });

  await check("security: the 6th wrong password in a row is refused with the waiting message (Auth.js endpoint)", async () => {
    const email = `nobody-${randomBytes(4).toString("hex")}@vellmar.example`;
    const codes: string[] = [];
    for (let i = 0; i < 6; i++) {
      const r = await credentialsCallback(base, email, `Wrong#Password${i}`, { "x-forwarded-for": fakeIp() });
      codes.push(new URL(r.location, base).searchParams.get("code") ?? `(${r.res.status} ${r.location})`);
    }
    assert(codes.slice(0, 5).every((c) => c === "bad-credentials") && codes[5] === "rate-limited", `codes: ${codes.join(", ")}`);
  });

  await check("security: the sign-in form shows the waiting message at the 6th wrong attempt", async () => {
    const context = await k.browser.newContext({ extraHTTPHeaders: { "x-forwarded-for": fakeIp() } });
    const page = await context.newPage();
    const email = `nobody-${randomBytes(4).toString("hex")}@vellmar.example`;
    let text = "";
    for (let i = 0; i < 6; i++) {
      await page.goto(`${base}/sign-in`);
      await page.getByLabel("E-mail address").fill(email);
      await page.getByLabel("Password").fill(`Wrong#Password${i}`);
      await page.getByRole("button", { name: "Sign in" }).click();
      const alert = page.locator("#sign-in-message");
      await alert.waitFor({ timeout: 15_000 });
      await page.waitForFunction(() => !document.querySelector("button[type=submit][disabled]"), undefined, { timeout: 15_000 }).catch(() => undefined);
      text = await alert.innerText();
      if (i < 5) assert(/do not match an account/.test(text), `attempt ${i + 1}: ${text}`);
    }
    assert(/Too many unsuccessful attempts\. Wait about 15 minutes/.test(text), `6th attempt: ${text}`);
    await context.close();
  });
}
