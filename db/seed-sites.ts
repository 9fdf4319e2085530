import type { Tx } from "./client";

/** Sites, streams and months of the demo organisation come from lib/demo (the engine's scenario). */
export async function seedDemoSites(_tx: Tx, _organisationId: string): Promise<void> {
  // Filled in when lib/demo lands (same commit series).
}
