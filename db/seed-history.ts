import { and, eq } from "drizzle-orm";
import { runOfSnapshot } from "@/lib/ledger/month-runs";
import type { LifecycleActor } from "@/lib/lifecycle/actor";
import { transitionMonth } from "@/lib/lifecycle/service";
import { unconfirmedKeys } from "@/lib/lifecycle/sign";
import type { TransitionName } from "@/lib/lifecycle/transitions";
import type { Db } from "./client";
import { DEMO_USERS } from "./demo-users";
import { latestSnapshot } from "./queries/snapshots";
import { findUserByEmail } from "./queries/users";
import { months, organisations, sites } from "./schema";

/**
 * A lived-in demo: the first months of Estuary Works went through the whole life cycle (balanced,
 * sent, signed, submitted to the invented authority), so statements, verification and the
 * history have something to show from the first sign-in. Runs only on months still at their
 * seeded state, so seeding again changes nothing.
 */
const PLAN: { site: string; period: string; steps: TransitionName[] }[] = [
  { site: "estuary", period: "2026-01", steps: ["balance", "send-for-review", "sign", "record-submission"] },
  { site: "estuary", period: "2026-02", steps: ["balance", "send-for-review", "sign", "record-submission"] },
  { site: "estuary", period: "2026-03", steps: ["balance", "send-for-review", "sign"] },
  { site: "estuary", period: "2026-04", steps: ["balance"] },
  { site: "dunmoor", period: "2026-01", steps: ["balance", "send-for-review", "sign"] },
];

const BY_STEP: Record<TransitionName, string> = {
  balance: "process_engineer",
  "send-for-review": "environmental_officer",
  return: "signatory",
  sign: "signatory",
  "record-submission": "environmental_officer",
  reopen: "environmental_officer",
};

export async function seedDemoHistory(db: Db, organisationId: string): Promise<void> {
  const [org] = await db.select().from(organisations).where(eq(organisations.id, organisationId));
  const actors = new Map<string, LifecycleActor>();
  for (const u of DEMO_USERS) {
    const row = await findUserByEmail(db, u.email);
    if (!row) continue;
    for (const role of u.roles) {
      actors.set(role, { organisationId, organisationName: org.name, userId: row.id, name: row.name, email: row.email, roles: u.roles, channel: "seed" });
    }
  }
  for (const item of PLAN) {
    const [site] = await db.select().from(sites).where(and(eq(sites.organisationId, organisationId), eq(sites.code, item.site)));
    if (!site) continue;
    const [month] = await db.select().from(months).where(and(eq(months.siteId, site.id), eq(months.period, item.period)));
    if (!month || month.state !== "open" || month.revision !== 1) continue;
    let version = month.version;
    for (const step of item.steps) {
      const actor = actors.get(BY_STEP[step]);
      if (!actor) break;
      // The demo signatory declares as a real one must: every unconfirmed value of the frozen record acknowledged.
      const snap = step === "sign" ? await latestSnapshot(db, month.id, month.revision) : null;
      const declared = snap ? { declaration: true, acknowledged: unconfirmedKeys(runOfSnapshot(snap).doc) } : {};
      const out = await transitionMonth(db, actor, {
        siteId: site.id,
        period: item.period,
        transition: step,
        expectedVersion: version,
        ...declared,
        ...(step === "record-submission" ? { reference: `EA-VN-${item.period.replace("-", "")}-014`, submittedOn: `2026-${String(Number(item.period.slice(5)) + 1).padStart(2, "0")}-12` } : {}),
      });
      version = out.version;
    }
  }
}
