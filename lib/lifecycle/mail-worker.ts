import "server-only";
import { getDb } from "@/db";
import { deliverPending } from "@/lib/mail/outbox";
import { mailTransport } from "@/lib/mail/transport";
import { env } from "@/lib/env";

const g = globalThis as unknown as { __synledgerMailWorker?: NodeJS.Timeout };

/**
 * Sends due outbox messages every ~15 s. One timer per process (kept on globalThis so a dev
 * reload does not start a second); a tick that finds the mail server down only logs, and the
 * outbox's back-off decides when to try again. Several processes may run it: claims use
 * SKIP LOCKED, so no message is sent twice.
 */
export function startMailWorker(): void {
  if (g.__synledgerMailWorker) return;
  let running = false;
  let lastError = "";
  const tick = async () => {
    if (running) return;
    running = true;
    try {
      const counts = await deliverPending(getDb(), mailTransport());
      if (counts.sent || counts.failed) console.log(`[mail] sent ${counts.sent}, retrying ${counts.retried}, given up ${counts.failed}`);
      lastError = "";
    } catch (err) {
      const message = err instanceof Error ? err.message : String(err);
      // Log a persisting problem once, not every 15 s.
      if (message !== lastError) console.error("[mail] outbox worker:", message);
      lastError = message;
    } finally {
      running = false;
    }
  };
  g.__synledgerMailWorker = setInterval(tick, env().MAIL_WORKER_INTERVAL_MS);
  g.__synledgerMailWorker.unref?.();
}
