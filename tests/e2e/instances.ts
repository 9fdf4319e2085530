/**
 * Several app instances on one database (issue 19), called from run.ts: a second `server.ts` on
 * port 3101 with the same build, database and AUTH_SECRET as the test app. People sign in on the
 * first; their session works on the second. At least 200 life-cycle transitions (an Open month is
 * balanced, then sent for sign-off and returned twenty times, on five months) go to both instances
 * concurrently; then every transition is recorded once (one audit event per success), each
 * notification it queued is delivered exactly once (the mail sink holds each outbox Message-ID
 * once, whichever instance's worker sent it), and the months end Balanced, as "return" leaves them.
 */
import { spawn, type ChildProcess } from "node:child_process";
import pg from "pg";
import { DEMO_USERS } from "../../db/demo-users";
import type { E2eKit } from "./lifecycle";

const user = (role: string) => DEMO_USERS.find((u) => u.roles.includes(role as never))!;
const PAIRS = 20; // (send for sign-off, return) × 20 per month, after a balance where the month is Open
type Step = "balance" | "send-for-review" | "return";
const ACTOR: Record<Step, string> = { balance: "process_engineer", "send-for-review": "environmental_officer", return: "signatory" };

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function signIn(base: string, email: string, password: string): Promise<string> {
  const csrfRes = await fetch(`${base}/api/auth/csrf`);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const jar = (res: Response) => res.headers.getSetCookie().map((l) => l.split(";")[0]);
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: jar(csrfRes).join("; "), origin: base },
    body: new URLSearchParams({ csrfToken, email, password, callbackUrl: `${base}/` }),
  });
  return [...jar(csrfRes), ...jar(res)].join("; ");
}

export async function instanceChecks(k: E2eKit): Promise<void> {
  const a = k.base;
  const b = a.replace(/:\d+$/, ":3101");
  let second: ChildProcess | null = null;
  try {
    await k.check("a second instance on the same database and secret serves the session signed in on the first", async () => {
      second = spawn("node", ["--import", "tsx", "server.ts"], {
        env: { ...process.env, PORT: "3101", HOST: "127.0.0.1", NODE_ENV: "production", MAIL_WORKER_INTERVAL_MS: "1000" },
        stdio: "ignore",
        detached: true,
      });
      for (let i = 0; i < 120; i++) {
        const ok = await fetch(`${b}/sign-in`).then((r) => r.ok, () => false);
        if (ok) break;
        await sleep(1000);
      }
      const cookie = await signIn(a, user("auditor").email, user("auditor").password);
      const res = await fetch(`${b}/api/v1/sites`, { headers: { cookie } });
      k.assert(res.status === 200, `the session of instance A answered ${res.status} on instance B`);
    });

    await k.check("200+ transitions across both instances: each recorded once, each notification delivered once", async () => {
      const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
      await db.connect();
      try {
        const cookies = Object.fromEntries(await Promise.all(Object.values(ACTOR).map(async (r) => [r, await signIn(a, user(r).email, user(r).password)] as const)));
        const sites = (await (await fetch(`${b}/api/v1/sites`, { headers: { cookie: cookies.process_engineer } })).json()) as { sites: { id: string; name: string }[] };
        const site = sites.sites.find((s) => s.name === "Estuary Works")!;
        const list = (await (await fetch(`${a}/api/v1/sites/${site.id}/months?year=2026`, { headers: { cookie: cookies.process_engineer } })).json()) as { months: { month: string; state: string; version: number }[] };
        const running = new Date().toISOString().slice(0, 7);
        const months = list.months.filter((m) => (m.state === "open" || m.state === "balanced") && m.month !== running && m.month !== "2026-08" && m.month !== "2026-06").slice(0, 5);
        k.assert(months.length === 5, `five Open or Balanced months of Estuary are needed, found ${months.map((m) => m.month).join(", ")}`);
        const plans = months.map((m) => [...(m.state === "open" ? (["balance"] as const) : []), ...Array.from({ length: PAIRS }, () => ["send-for-review", "return"] as const).flat()]);
        const planned = plans.reduce((n, p) => n + p.length, 0);
        const since = (await db.query("select now() as t, coalesce(max(id), 0) as outbox from mail_outbox")).rows[0];
        let done = 0;
        const failures: string[] = [];
        await Promise.all(
          months.map(async (m, mi) => {
            let version = m.version;
            for (let i = 0; i < plans[mi].length; i++) {
              const step = plans[mi][i];
              const base = (i + mi) % 2 === 0 ? a : b;
              const res = await fetch(`${base}/api/v1/sites/${site.id}/months/${m.month}/transitions`, {
                method: "POST",
                headers: { cookie: cookies[ACTOR[step]], "content-type": "application/json", origin: base },
                body: JSON.stringify({ transition: step, expectedVersion: version, ...(step === "send-for-review" ? {} : { reason: "Two-instance test: a cycle of the life cycle." }) }),
              });
              const body = (await res.json()) as { version?: number; error?: { message: string } };
              if (res.status !== 200) {
                failures.push(`${m.month} ${step} on ${base}: ${res.status} ${body.error?.message ?? ""}`);
                return;
              }
              version = body.version!;
              done++;
            }
          }),
        );
        k.assert(failures.length === 0, failures.slice(0, 3).join("; "));
        k.assert(done === planned && planned >= 200, `${done} of ${planned} transitions went through`);
        const audited = await db.query(
          "select count(*)::int as n from audit_events where at >= $1 and action in ('month.balance', 'month.send-for-review', 'month.return') and entity_id in (select id::text from months where site_id = $2 and period = any($3))",
          [since.t, site.id, months.map((m) => m.month)],
        );
        k.assert(audited.rows[0].n === planned, `${audited.rows[0].n} audit events for ${planned} transitions`);
        // Every notice queued since the start is sent, by whichever instance claimed it, exactly once.
        let pending = -1;
        for (let i = 0; i < 90 && pending !== 0; i++) {
          pending = (await db.query("select count(*)::int as n from mail_outbox where id > $1 and status = 'pending'", [since.outbox])).rows[0].n;
          if (pending) await sleep(1000);
        }
        k.assert(pending === 0, `${pending} notices still waiting after 90 s`);
        const ids = (await db.query("select id from mail_outbox where id > $1 and status = 'sent'", [since.outbox])).rows.map((r) => Number(r.id));
        k.assert(ids.length >= planned, `only ${ids.length} notices for ${planned} transitions`);
        const sink = (await (await fetch(`${process.env.MAIL_VIEW_URL}/api/messages`)).json()) as { messageId: string | null }[];
        const seen = new Map<string, number>();
        const key = (v: string) => v.replace(/^<|>$/g, "");
        for (const msg of sink) if (msg.messageId) seen.set(key(msg.messageId), (seen.get(key(msg.messageId)) ?? 0) + 1);
        const wrong = ids.filter((id) => seen.get(`outbox-${id}@synledger.invalid`) !== 1);
        k.assert(wrong.length === 0, `${wrong.length} of ${ids.length} notices not delivered exactly once (e.g. outbox ${wrong[0]}: ${seen.get(`outbox-${wrong[0]}@synledger.invalid`) ?? 0} times)`);
        const after = (await (await fetch(`${b}/api/v1/sites/${site.id}/months?year=2026`, { headers: { cookie: cookies.process_engineer } })).json()) as { months: { month: string; state: string }[] };
        k.assert(months.every((m) => after.months.find((x) => x.month === m.month)?.state === "balanced"), "a month did not end Balanced");
      } finally {
        await db.end();
      }
    });
  } finally {
    if (second) {
      try {
        process.kill(-(second as ChildProcess).pid!, "SIGTERM");
      } catch {
        /* already gone */
      }
    }
  }
}
