/**
 * Security checks against the running app, called from run.ts: security headers on pages, API
 * answers, redirects, errors and static files; the session cookie's flags over HTTP and behind
 * an HTTPS proxy; the cross-site refusal of cookie-authenticated API mutations; and the sign-in
 * rate limit, through Auth.js's endpoint and through the form; forwarding headers believed only
 * from the trusted proxy address; body limits and the attachments' own policy. Uses fetch for
 * everything except the form. Attempts that need their own client address come through the
 * trusted proxy (from-proxy.ts) with a made-up X-Forwarded-For, so the per-address limit of the
 * other browser tests (which connect from 127.0.0.1) is left untouched.
 */
import { createHash, randomBytes } from "node:crypto";
import { readFileSync } from "node:fs";
import type { Browser } from "playwright-core";
import { DEMO_USERS } from "../../db/demo-users";
import { clientAddress, fetchFor } from "./from-proxy";

export interface SecurityKit {
  browser: Browser;
  base: string;
  check: (name: string, fn: () => Promise<void>) => Promise<void>;
  assert: (cond: unknown, message: string) => asserts cond;
}

const EVIL = "https://evil.example";
const auditor = DEMO_USERS.find((u) => u.roles.includes("auditor"))!;
const fakeIp = clientAddress;

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
  const send = fetchFor(extra);
  const csrfRes = await send(`${base}/api/auth/csrf`, { headers: extra });
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const csrfCookies = cookiesOf(csrfRes).jar;
  const res = await send(`${base}/api/auth/callback/credentials`, {
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

  await check("security: the build prerendered no signed-in page (each reads its request, so none is served the same to everyone)", async () => {
    // A page that decides who is asking without reading the request is rendered once at build
    // time; its answer (a redirect to sign-in) would then be served to every visitor.
    const dist = process.env.NEXT_DIST_DIR ?? ".next";
    const manifest = JSON.parse(readFileSync(`${dist}/prerender-manifest.json`, "utf8")) as { routes: Record<string, unknown> };
    const PUBLIC = new Set(["/_global-error", "/_not-found", "/verify", "/sign-in", "/forbidden"]);
    const prerendered = Object.keys(manifest.routes).filter((r) => !PUBLIC.has(r));
    assert(prerendered.length === 0, `prerendered at build time: ${prerendered.join(", ")}`);
  });

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

  await check("security: the 6th wrong password from one address is refused with the waiting message (Auth.js endpoint)", async () => {
    const email = `nobody-${randomBytes(4).toString("hex")}@vellmar.example`;
    const from = { "x-forwarded-for": fakeIp() };
    const codes: string[] = [];
    for (let i = 0; i < 6; i++) {
      const r = await credentialsCallback(base, email, `Wrong#Password${i}`, from);
      codes.push(new URL(r.location, base).searchParams.get("code") ?? `(${r.res.status} ${r.location})`);
    }
    assert(codes.slice(0, 5).every((c) => c === "bad-credentials") && codes[5] === "rate-limited", `codes: ${codes.join(", ")}`);
    const elsewhere = await credentialsCallback(base, email, "Wrong#Password6", { "x-forwarded-for": fakeIp() });
    const code = new URL(elsewhere.location, base).searchParams.get("code");
    assert(code === "bad-credentials", `another address is judged on its own: ${code}`);
  });

  // Regression (issue 11): each failed sign-in with its own X-Forwarded-For counted as a new address.
  await check("security: X-Forwarded-For entries a client writes itself make no new addresses: the 31st failure from one client is refused", async () => {
    const client = fakeIp();
    const codes: string[] = [];
    for (let i = 0; i < 31; i++) {
      // The client wrote the first entry; the proxy appended the address it really saw.
      const spoofed = `203.0.113.${i + 1}, ${client}`;
      const r = await credentialsCallback(base, `spray-${i}-${randomBytes(3).toString("hex")}@vellmar.example`, "Wrong#Password", { "x-forwarded-for": spoofed });
      codes.push(new URL(r.location, base).searchParams.get("code") ?? `(${r.res.status})`);
    }
    assert(codes.slice(0, 30).every((c) => c === "bad-credentials") && codes[30] === "rate-limited", `codes: ${[...new Set(codes)].join(", ")}; last ${codes[30]}`);
  });

  await check("security: forwarding headers from an ordinary client are ignored: no __Secure- cookie over plain HTTP", async () => {
    // From 127.0.0.1 (not the trusted proxy): X-Forwarded-Proto https must not make the server think it is behind TLS.
    const csrfRes = await fetch(`${base}/api/auth/csrf`, { headers: { "x-forwarded-proto": "https" } });
    const names = cookiesOf(csrfRes).lines.map((l) => l.split("=")[0]);
    assert(names.length > 0 && names.every((n) => !n.startsWith("__Secure-") && !n.startsWith("__Host-")), `cookies: ${names.join(", ")}`);
  });

  // Regression (issue 11): Origin evil.example with X-Forwarded-Host evil.example passed the same-origin check.
  await check("security: a cookie-authenticated mutation with Origin and X-Forwarded-Host of another site is refused (403)", async () => {
    const res = await fetch(`${base}/api/v1/calculate`, {
      method: "POST",
      body: readFileSync("examples/estuary-2026-03.json", "utf8"),
      headers: { cookie: session, "content-type": "application/json", origin: EVIL, "x-forwarded-host": "evil.example" },
    });
    const json = (await res.json()) as { error?: { code?: string } };
    assert(res.status === 403 && json.error?.code === "cross_site_request", `→ ${res.status} ${JSON.stringify(json).slice(0, 120)}`);
  });

  // Regression (issue 11): the proxy kept only the first 10 MB of a body, so /verify judged a truncated copy.
  await check("security: /api/v1/verify judges a 12 MB upload whole (its SHA-256 is the whole file's), and refuses one over its 20 MB limit (413)", async () => {
    const origin = new URL(base).origin;
    const send = (bytes: Buffer) => {
      const form = new FormData();
      form.append("file", new Blob([new Uint8Array(bytes)], { type: "application/pdf" }), "big.pdf");
      return fetch(`${base}/api/v1/verify`, { method: "POST", body: form, headers: { cookie: session, origin } });
    };
    const twelve = Buffer.alloc(12 * 1024 * 1024, 0x20);
    twelve.write("%PDF-1.7\n", 0);
    const res = await send(twelve);
    const json = (await res.json()) as { sha256?: string; verdict?: string };
    const whole = createHash("sha256").update(twelve).digest("hex");
    assert(res.status === 200 && json.sha256 === whole, `→ ${res.status}, judged ${json.sha256?.slice(0, 12)}…, the file is ${whole.slice(0, 12)}…`);
    const over = await send(Buffer.alloc(21 * 1024 * 1024, 0x20));
    await over.arrayBuffer();
    assert(over.status === 413, `21 MB → ${over.status}`);
  });

  // Regression (issue 11): a 10 485 700-byte attachment (under the 10 MiB limit) was cut at 10 MB by the proxy; its own CSP was replaced by the app's.
  await check("security: a 10 485 700-byte attachment is accepted whole and served under its own sandboxing policy", async () => {
    const engineer = DEMO_USERS.find((u) => u.roles.includes("process_engineer"))!;
    const signedIn = await credentialsCallback(base, engineer.email, engineer.password, { "x-forwarded-for": fakeIp() });
    const cookie = signedIn.jar;
    const sites = (await (await fetch(`${base}/api/v1/sites`, { headers: { cookie } })).json()) as { sites: { id: string; name: string }[] };
    const estuary = sites.sites.find((x) => x.name === "Estuary Works");
    assert(estuary, `no Estuary Works in ${JSON.stringify(sites).slice(0, 120)}`);
    const size = 10_485_700;
    const pdf = Buffer.alloc(size, 0x20);
    pdf.write("%PDF-1.7\n", 0);
    pdf.write("\n%%EOF\n", size - 7);
    const form = new FormData();
    form.append("category", "other");
    form.append("file", new Blob([pdf], { type: "application/pdf" }), "calibration-e2e.pdf");
    const res = await fetch(`${base}/api/v1/sites/${estuary.id}/months/2026-06/attachments`, { method: "POST", body: form, headers: { cookie, origin: new URL(base).origin } });
    const json = (await res.json()) as { attachment?: { id: string; size?: number; sizeBytes?: number }; error?: { message?: string } };
    assert(res.status === 201 && json.attachment, `→ ${res.status} ${JSON.stringify(json).slice(0, 160)}`);
    const got = await fetch(`${base}/api/v1/attachments/${json.attachment.id}`, { headers: { cookie } });
    const body = Buffer.from(await got.arrayBuffer());
    assert(body.length === size && body.equals(pdf), `downloaded ${body.length} bytes, not the ${size} sent`);
    const csp = got.headers.get("content-security-policy") ?? "";
    assert(csp.includes("default-src 'none'") && csp.includes("sandbox") && !csp.includes("'self'"), `attachment CSP: ${csp}`);
    await fetch(`${base}/api/v1/attachments/${json.attachment.id}`, { method: "DELETE", headers: { cookie, origin: new URL(base).origin } });
  });

  // Regression (issue 11): a copy of a cookie kept reading for the JWT's 8 h after sign-out.
  await check("security: after signing out, a copy of the session cookie reads nothing (401)", async () => {
    const signedIn = await credentialsCallback(base, auditor.email, auditor.password, { "x-forwarded-for": fakeIp() });
    const copy = signedIn.jar;
    const before = await fetch(`${base}/api/v1/sites`, { headers: { cookie: copy } });
    assert(before.status === 200, `signed in: ${before.status}`);
    const csrfRes = await fetch(`${base}/api/auth/csrf`, { headers: { cookie: copy } });
    const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
    const jar = [copy, cookiesOf(csrfRes).jar].filter(Boolean).join("; ");
    const out = await fetch(`${base}/api/auth/signout`, {
      method: "POST",
      redirect: "manual",
      headers: { cookie: jar, "content-type": "application/x-www-form-urlencoded", origin: base },
      body: new URLSearchParams({ csrfToken, callbackUrl: `${base}/sign-in` }),
    });
    assert(out.status === 302, `sign-out → ${out.status}`);
    const after = await fetch(`${base}/api/v1/sites`, { headers: { cookie: copy } });
    assert(after.status === 401, `the copy after sign-out → ${after.status}`);
  });

  await check("security: Auth.js's routes, API routes and pages answer hostile path segments (an escaped lone surrogate, a stray %) without a 5xx", async () => {
    const hostile = ["(a+)+", "..%2F..%2Fetc%2Fpasswd", "%00", "%ED%A0%80", "%", "%E0%A4%A", "1e999", "a".repeat(1000), "callback/%28", "signin/%5B"];
    const bad: string[] = [];
    for (const prefix of ["/api/auth/", "/api/v1/sites/", "/sites/"]) {
      for (const h of hostile) {
        for (const method of ["GET", "POST"]) {
          const res = await fetch(`${base}${prefix}${h}`, { method, redirect: "manual", headers: { cookie: session, ...(method === "POST" ? { origin: base, "content-type": "application/x-www-form-urlencoded" } : {}) }, body: method === "POST" ? "" : undefined });
          await res.arrayBuffer();
          if (res.status >= 500) bad.push(`${method} ${prefix}${h.slice(0, 30)} → ${res.status}`);
        }
      }
    }
    assert(bad.length === 0, bad.join("; "));
  });

  await check("security: the sign-in form shows the waiting message at the 6th wrong attempt", async () => {
    // The browser connects from 127.0.0.1, an ordinary client: its failures count against that address.
    const context = await k.browser.newContext();
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
