/**
 * npm run audit:verify [-- --org ORGANISATION_ID]: checks the audit trail's hash chain of every
 * organisation (lib/audit/chain.ts) against DATABASE_URL and names the first broken link of each
 * broken chain. Exit 0 when every chain is whole, 1 when a link is broken, 2 when it cannot run.
 */
import { createDb } from "../db/client";
import { env } from "../lib/env";
import { verifyAuditChains } from "../db/queries/audit";

async function main(): Promise<number> {
  const url = env().DATABASE_URL;
  if (!url) {
    console.error("audit:verify: set DATABASE_URL (npm start prints it; the app's own role can read the trail)");
    return 2;
  }
  const i = process.argv.indexOf("--org");
  const org = i > 0 ? process.argv[i + 1] : undefined;
  const db = createDb(url, 1);
  try {
    const r = await verifyAuditChains(db, org);
    console.log(`audit chain: ${r.organisations} organisation(s), ${r.events} event(s) read${r.beforeChain ? `, ${r.beforeChain} recorded before the chain began (not covered)` : ""}`);
    for (const b of r.breaks) console.log(`BROKEN organisation ${b.organisationId}: event ${b.id} (${b.at}): ${b.reason}`);
    if (r.breaks.length === 0) console.log("every chain is whole");
    return r.breaks.length ? 1 : 0;
  } finally {
    await db.$client.end();
  }
}

main().then((code) => process.exit(code), (err) => {
  console.error(`audit:verify: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(2);
});
