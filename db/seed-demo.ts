import { and, eq } from "drizzle-orm";
import { hashPassword } from "@/lib/auth/password";
import { ensureDemoCertificate } from "@/lib/signing/demo-seed";
import { seedDemoHistory } from "./seed-history";
import type { Db } from "./client";
import { DEMO_ORGANISATION, DEMO_USERS } from "./demo-users";
import { recordAudit } from "./queries/audit";
import { findUserByEmail } from "./queries/users";
import { memberships, organisations, users } from "./schema";
import { seedDemoSites } from "./seed-sites";

export async function seedDemo(db: Db): Promise<void> {
  // Hash outside the transaction (bcrypt is slow and needs no lock), and only for new accounts.
  const hashes = new Map<string, string>();
  for (const u of DEMO_USERS) {
    if (!(await findUserByEmail(db, u.email))) hashes.set(u.email, await hashPassword(u.password));
  }

  const organisationId = await db.transaction(async (tx) => {
    await tx.insert(organisations).values(DEMO_ORGANISATION).onConflictDoNothing({ target: organisations.slug });
    const [org] = await tx.select().from(organisations).where(eq(organisations.slug, DEMO_ORGANISATION.slug));

    for (const u of DEMO_USERS) {
      const existing = await findUserByEmail(tx, u.email);
      const user =
        existing ??
        (await tx.insert(users).values({ email: u.email, name: u.name, passwordHash: hashes.get(u.email)! }).returning())[0];
      const [m] = await tx
        .select()
        .from(memberships)
        .where(and(eq(memberships.userId, user.id), eq(memberships.organisationId, org.id)));
      if (!m) {
        await tx.insert(memberships).values({ userId: user.id, organisationId: org.id, roles: u.roles });
        await recordAudit(tx, {
          organisationId: org.id,
          actorLabel: "demo seed",
          channel: "seed",
          action: "member.added",
          entity: "membership",
          entityId: user.id,
          after: { email: u.email, roles: u.roles },
        });
      }
    }
    await seedDemoSites(tx, org.id);
    // The demo signs statements end to end, so it needs a (self-signed) certificate from the start.
    await ensureDemoCertificate(tx, org.id);
    return org.id;
  });
  await seedDemoHistory(db, organisationId);
}
