import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { closeTestDb, testDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { actAs } from "../support/mock-auth";

vi.mock("@/auth", () => import("../support/mock-auth"));
process.env.DATABASE_URL ??= "";

const { currentActor, guardedAction } = await import("@/lib/auth/guard");
const { personOf, v1Route } = await import("@/lib/api/route");

let a: FixtureOrg;
let b: FixtureOrg;
beforeAll(async () => {
  a = await createOrg(testDb(), "GuardA");
  b = await createOrg(testDb(), "GuardB");
});
afterAll(closeTestDb);

describe("currentActor re-reads the membership from the database", () => {
  it("gives the actor with the roles held in the organisation", async () => {
    actAs(a.session("environmental_officer"));
    expect(await currentActor()).toMatchObject({ organisationId: a.id, roles: ["environmental_officer"] });
  });
  it("refuses a session that names an organisation the user does not belong to", async () => {
    const forged = a.session("administrator");
    forged.user.organisationId = b.id;
    actAs(forged);
    expect(await currentActor()).toBeNull();
  });
  it("is null when signed out", async () => {
    actAs(null);
    expect(await currentActor()).toBeNull();
  });
});

describe("v1Route answers 401 and 403 as JSON", () => {
  const route = v1Route({ permission: "org:manage-users", what: "manage users" }, async (_req, caller) => Response.json({ org: personOf(caller).organisationId }));
  const call = () => route(new Request("http://test/"), { params: Promise.resolve({}) });

  it("401 when signed out", async () => {
    actAs(null);
    const res = await call();
    expect(res.status).toBe(401);
    expect(await res.json()).toEqual({ error: { code: "unauthorized", message: "Sign in first." } });
  });
  it("403 for a role without the permission, naming what was refused", async () => {
    actAs(a.session("auditor"));
    const res = await call();
    expect(res.status).toBe(403);
    expect((await res.json()).error.message).toBe("Your role does not allow you to manage users.");
  });
  it("200 for the administrator, scoped to their own organisation", async () => {
    actAs(a.session("administrator"));
    const res = await call();
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ org: a.id });
  });
});

describe("guardedAction", () => {
  it("returns a refusal instead of running the action", async () => {
    actAs(b.session("process_engineer"));
    let ran = false;
    const r = await guardedAction("month:sign", "sign statements", async () => {
      ran = true;
      return { ok: true };
    });
    expect(ran).toBe(false);
    expect(r).toEqual({ ok: false, message: "Your role does not allow you to sign statements." });
  });
});
