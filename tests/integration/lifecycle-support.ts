/**
 * Shared set-up of the life-cycle tests: a fixture organisation with the two demo sites and
 * their twelve seeded months of 2026 (Open, computing), and a demo signing certificate.
 */
import { and, eq } from "drizzle-orm";
import { seedDemoSites } from "@/db/seed-sites";
import { gasAnalyses, months, readings, sites, streams } from "@/db/schema";
import { demoYearMonths } from "@/lib/demo/scenario";
import { HttpError } from "@/lib/auth/errors";
import type { Role } from "@/lib/auth/roles";
import { latestSnapshot } from "@/db/queries/snapshots";
import { runOfSnapshot } from "@/lib/ledger/month-runs";
import type { LifecycleActor } from "@/lib/lifecycle/actor";
import { transitionMonth, type TransitionInput } from "@/lib/lifecycle/service";
import { unconfirmedKeys } from "@/lib/lifecycle/sign";
import { ensureDemoCertificate } from "@/lib/signing/demo-seed";
import { asLifecycle, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";

export interface LifecycleOrg extends FixtureOrg {
  estuaryId: string;
  dunmoorId: string;
  actor(role: Role): LifecycleActor;
}

export async function lifecycleOrg(label = "Life"): Promise<LifecycleOrg> {
  process.env.SIGNING_SECRET ??= "integration-test-signing-secret-0123456789";
  const db = testDb();
  const org = await createOrg(db, label);
  await db.transaction(async (tx) => {
    await seedDemoSites(tx, org.id);
    await ensureDemoCertificate(tx, org.id);
  });
  const rows = await db.select().from(sites).where(eq(sites.organisationId, org.id));
  const id = (code: string) => rows.find((s) => s.code === code)!.id;
  return {
    ...org,
    estuaryId: id("estuary"),
    dunmoorId: id("dunmoor"),
    actor(role: Role): LifecycleActor {
      const m = org.members[role];
      return { organisationId: org.id, organisationName: org.name, userId: m.id, name: m.name, email: m.email, roles: m.roles };
    },
  };
}

export async function monthRow(siteId: string, period: string) {
  const [m] = await testDb().select().from(months).where(and(eq(months.siteId, siteId), eq(months.period, period)));
  return m;
}

/**
 * Performs a transition at the month's current version. Signing makes the declaration and
 * acknowledges the statement's unconfirmed values, as the signatory does on the review page,
 * unless the test says otherwise.
 */
export async function act(org: LifecycleOrg, role: Role, siteId: string, period: string, transition: TransitionInput["transition"], more: Partial<TransitionInput> = {}) {
  const m = await monthRow(siteId, period);
  const declared = transition === "sign" ? { declaration: true, acknowledged: await unconfirmedOf(m.id, m.revision) } : {};
  return transitionMonth(testDb(), org.actor(role), { siteId, period, transition, expectedVersion: m.version, ...declared, ...more });
}

/** The unconfirmed values of a revision's frozen record (none when it has no snapshot). */
export async function unconfirmedOf(monthId: string, revision: number): Promise<string[]> {
  const snap = await latestSnapshot(testDb(), monthId, revision);
  return snap ? unconfirmedKeys(runOfSnapshot(snap).doc) : [];
}

export async function refusal(run: () => Promise<unknown>): Promise<HttpError> {
  try {
    await run();
  } catch (err) {
    if (err instanceof HttpError) return err;
    throw err;
  }
  throw new Error("expected a refusal");
}

/** Sets a month's state directly, for table-driven tests that start from every state. */
export async function forceState(siteId: string, period: string, state: (typeof months.$inferSelect)["state"]) {
  await asLifecycle((tx) => tx.update(months).set({ state }).where(and(eq(months.siteId, siteId), eq(months.period, period))));
}

/**
 * Twelve whole months of a past year at one of the org's demo sites, stored as the seed stores
 * months (Open), for tests that need a year that has ended (the demo's own year may still run).
 */
export async function seedPastYear(org: LifecycleOrg, siteCode: "estuary" | "dunmoor", year: number): Promise<string> {
  const siteId = siteCode === "estuary" ? org.estuaryId : org.dunmoorId;
  const db = testDb();
  const siteStreams = await db.select().from(streams).where(eq(streams.siteId, siteId));
  const idOf = new Map(siteStreams.map((s) => [s.key, s.id]));
  for (const doc of demoYearMonths(siteCode, year)) {
    const [m] = await db.insert(months).values({ siteId, period: doc.month, emissionsMethod: doc.method.emissions, factorSet: doc.method.factor_set, gwp: doc.method.gwp }).returning();
    for (const [key, a] of Object.entries(doc.analyses)) {
      await db.insert(gasAnalyses).values({ monthId: m.id, key, components: Object.fromEntries(Object.entries(a.components).map(([c, v]) => [c, v!.toFixed()])) });
    }
    await db.insert(readings).values(doc.streams.map((s) => ({ monthId: m.id, streamId: idOf.get(s.id)!, quantity: s.quantity.toFixed(), unit: s.unit })));
  }
  return siteId;
}

/** Takes a month Open → Balanced → In review → Signed through the service, as the plant's people would. */
export async function signThrough(org: LifecycleOrg, siteId: string, period: string, reason?: string) {
  await act(org, "process_engineer", siteId, period, "balance", reason ? { reason } : {});
  await act(org, "environmental_officer", siteId, period, "send-for-review");
  return act(org, "signatory", siteId, period, "sign");
}
