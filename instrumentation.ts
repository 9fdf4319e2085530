/**
 * Next's start-up hook. Runs the mail outbox worker inside the app process so notifications
 * queued by the month life cycle go out without a separate service. Node runtime only (the
 * worker needs pg and nodemailer; NEXT_RUNTIME is Next's own); MAIL_WORKER=0 turns it off, e.g. when several app instances
 * run and one dedicated `scripts/deliver-mail.ts` job should do the sending instead.
 */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { env } = await import("./lib/env");
  if (env().MAIL_WORKER === "0") return;
  const { startMailWorker } = await import("./lib/lifecycle/mail-worker");
  startMailWorker();
}
