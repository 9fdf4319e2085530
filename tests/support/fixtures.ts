import { randomUUID } from "node:crypto";
import type { Session } from "next-auth";
import type { Db } from "@/db/client";
import { openSession } from "@/db/queries/sessions";
import { memberships, organisations, sites, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { ROLES, type Role } from "@/lib/auth/roles";

export const FIXTURE_PASSWORD = "Fixture#Passw0rd";
let hash: string | null = null;

export interface FixtureUser {
  id: string;
  /** An open user_sessions row, as a sign-in would have made. */
  sessionId: string;
  email: string;
  name: string;
  roles: Role[];
}

export interface FixtureOrg {
  id: string;
  name: string;
  siteId: string;
  siteName: string;
  siteCode: string;
  /** One member per role, keyed by role, and `all`: one member holding every role. */
  members: Record<Role | "all", FixtureUser>;
  session(role: Role | "all"): Session;
}

/** A fresh organisation with one site and one member per role; unique names so runs never clash. */
export async function createOrg(db: Db, label = "Org"): Promise<FixtureOrg> {
  hash ??= await hashPassword(FIXTURE_PASSWORD);
  const tag = randomUUID().slice(0, 8);
  const [org] = await db
    .insert(organisations)
    .values({ name: `${label} ${tag}`, slug: `${label.toLowerCase()}-${tag}` })
    .returning();
  const [site] = await db
    .insert(sites)
    .values({ organisationId: org.id, name: `${label} works ${tag}`, code: `w${tag}` })
    .returning();
  const members = {} as Record<Role | "all", FixtureUser>;
  for (const role of [...ROLES, "all" as const]) {
    const roles: Role[] = role === "all" ? [...ROLES] : [role];
    const email = `${role}.${tag}@fixture.example`;
    const [u] = await db.insert(users).values({ email, name: `${role} ${tag}`, passwordHash: hash }).returning();
    await db.insert(memberships).values({ userId: u.id, organisationId: org.id, roles });
    const sessionId = await openSession(db, u.id, "192.0.2.10", "fixture");
    members[role] = { id: u.id, sessionId, email, name: u.name, roles };
  }
  return {
    id: org.id,
    name: org.name,
    siteId: site.id,
    siteName: site.name,
    siteCode: site.code,
    members,
    session(role: Role | "all"): Session {
      const m = members[role];
      return {
        user: { id: m.id, sessionId: m.sessionId, email: m.email, name: m.name, organisationId: org.id, organisationName: org.name, roles: m.roles },
        expires: new Date(Date.now() + 3600_000).toISOString(),
      };
    },
  };
}

/** A new month row as lockMonth makes it (the site's default method), for fixtures that insert months directly. */
export const newMonth = (siteId: string, period: string) => ({
  siteId,
  period,
  emissionsMethod: "carbon-mass-balance",
  factorSet: "ipcc-2006",
  gwp: "AR5",
});
