/**
 * npm run org:create -- --name "Company" --admin-email person@company.example: creates an
 * organisation and prints a one-time invitation link for its first administrator (valid 72 h).
 * Uses DATABASE_URL and APP_URL (the address the link opens). Bad input: exit 2, the field named.
 */
import { createDb } from "../db/client";
import { appUrl, env } from "../lib/env";
import { createOrganisation } from "../lib/onboarding/create-organisation";

function arg(name: string): string | undefined {
  const i = process.argv.indexOf(name);
  return i > 0 ? process.argv[i + 1] : undefined;
}

async function main(): Promise<number> {
  const url = env().DATABASE_URL;
  if (!url) {
    console.error("org:create: set DATABASE_URL (and APP_URL, the address the invitation link opens)");
    return 2;
  }
  const name = arg("--name");
  const adminEmail = arg("--admin-email");
  if (!name || !adminEmail) {
    console.error('usage: npm run org:create -- --name "Company" --admin-email person@company.example');
    return 2;
  }
  const db = createDb(url, 1);
  try {
    const r = await createOrganisation(db, { name, adminEmail }, appUrl());
    console.log(`organisation: ${r.organisation.name} (${r.organisation.slug}, ${r.organisation.id})`);
    console.log(`invitation for ${adminEmail.toLowerCase()} as administrator, valid until ${r.expiresAt.toISOString()}; it works once:`);
    console.log(r.link);
    return 0;
  } catch (err) {
    const issues = (err as { issues?: { path: PropertyKey[]; message: string }[] }).issues;
    if (issues) {
      for (const i of issues) console.error(`org:create: ${i.path.join(".") === "adminEmail" ? "--admin-email" : "--name"}: ${i.message}`);
      return 2;
    }
    throw err;
  } finally {
    await db.$client.end();
  }
}

main().then((code) => process.exit(code), (err) => {
  console.error(`org:create: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
