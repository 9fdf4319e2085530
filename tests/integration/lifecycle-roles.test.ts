import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { statements } from "@/db/schema";
import { ROLES, type Role } from "@/lib/auth/roles";
import { RULES, TRANSITIONS, mayPerform, type TransitionName } from "@/lib/lifecycle/transitions";
import type { MonthState } from "@/lib/month-states";
import { closeTestDb, testDb } from "../support/db";
import { act, forceState, lifecycleOrg, monthRow, refusal, type LifecycleOrg } from "./lifecycle-support";

let org: LifecycleOrg;

beforeAll(async () => {
  org = await lifecycleOrg("Roles");
}, 90_000);
afterAll(closeTestDb);

/** Who may do what, written out by hand so the table in lib/lifecycle is checked, not echoed. */
const ALLOWED: Record<TransitionName, Role[]> = {
  balance: ["process_engineer"],
  "send-for-review": ["environmental_officer"],
  return: ["signatory"],
  sign: ["signatory"],
  "record-submission": ["environmental_officer"],
  reopen: ["environmental_officer", "signatory"],
};

const EXTRA: Partial<Record<TransitionName, object>> = {
  return: { reason: "Intensity row needs the steam import note." },
  reopen: { reason: "Fuel meter corrected after calibration report." },
  "record-submission": { reference: "EA-2026-0042", submittedOn: "2026-04-02" },
};

const cases = TRANSITIONS.flatMap((t) => ROLES.map((r) => ({ t, r, allowed: ALLOWED[t].includes(r) })));

describe("every transition × every role", () => {
  it("the pure table agrees with the hand-written one", () => {
    for (const c of cases) expect(mayPerform([c.r], c.t), `${c.t} by ${c.r}`).toBe(c.allowed);
  });

  // Dunmoor months 01–07 close within tolerance; each allowed pair gets its own month.
  let next = 1;
  for (const c of cases) {
    const period = c.allowed ? `2026-0${next++}` : "2026-09";
    it(`${c.t} by ${c.r}: ${c.allowed ? "allowed" : "refused"}`, async () => {
      const from: MonthState = RULES[c.t].from[0];
      // In review is reached through the service, so the revision has its frozen record to sign.
      if (from === "in_review") {
        await forceState(org.dunmoorId, period, "balanced");
        await act(org, "environmental_officer", org.dunmoorId, period, "send-for-review");
      } else await forceState(org.dunmoorId, period, from);
      const before = await monthRow(org.dunmoorId, period);
      if (!c.allowed) {
        const err = await refusal(() => act(org, c.r, org.dunmoorId, period, c.t, EXTRA[c.t]));
        expect(err.status).toBe(403);
        const after = await monthRow(org.dunmoorId, period);
        expect(after).toMatchObject({ state: before.state, version: before.version, revision: before.revision });
        return;
      }
      const out = await act(org, c.r, org.dunmoorId, period, c.t, EXTRA[c.t]);
      expect(out.state).toBe(RULES[c.t].to);
      const after = await monthRow(org.dunmoorId, period);
      expect(after.state).toBe(RULES[c.t].to);
      expect(after.version).toBe(before.version + 1);
      expect(after.revision).toBe(c.t === "reopen" ? before.revision + 1 : before.revision);
      if (c.t === "sign") {
        const [s] = await testDb().select({ id: statements.id, revision: statements.revision }).from(statements).where(eq(statements.monthId, after.id));
        expect(s).toMatchObject({ id: out.statementId, revision: 1 });
      }
    }, 60_000);
  }
});

describe("state guards", () => {
  const wrong: [TransitionName, Role, MonthState][] = [
    ["sign", "signatory", "open"],
    ["sign", "signatory", "balanced"],
    ["send-for-review", "environmental_officer", "open"],
    ["balance", "process_engineer", "signed"],
    ["record-submission", "environmental_officer", "in_review"],
    ["reopen", "signatory", "in_review"],
    ["return", "signatory", "signed"],
  ];
  for (const [t, r, s] of wrong) {
    it(`${t} from ${s} is refused`, async () => {
      await forceState(org.dunmoorId, "2026-11", s);
      const err = await refusal(() => act(org, r, org.dunmoorId, "2026-11", t, EXTRA[t]));
      expect(err).toMatchObject({ status: 409, code: "wrong_state" });
      expect((await monthRow(org.dunmoorId, "2026-11")).state).toBe(s);
    });
  }
});
