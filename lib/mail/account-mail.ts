import "server-only";
import { escapeHtml } from "./html";
import { appUrl, type OutgoingMail } from "./transport";

/** Told to the account holder when wrong passwords pile up on their account. */
export function failedSignInsMail(input: { to: string; name: string; failures: number; addresses: string[]; windowMinutes: number }): OutgoingMail {
  const shown = input.addresses.slice(0, 5);
  const more = input.addresses.length - shown.length;
  const from = `${shown.join(", ")}${more > 0 ? ` and ${more} more` : ""}`;
  const link = `${appUrl()}/account`;
  const text = [
    `Hello ${input.name},`,
    "",
    `Someone has given a wrong password for your Synledger account ${input.to} ${input.failures} times in the last ${input.windowMinutes} minutes, from ${input.addresses.length === 1 ? "the address" : "the addresses"} ${from}.`,
    "",
    "If that was you, there is nothing to do: you can still sign in. Further attempts are slowed down for a while.",
    "If it was not you, change your password and end your other sessions here:",
    link,
    "",
    "Synledger never asks for your password by e-mail.",
  ].join("\n");
  const html = `<p>Hello ${escapeHtml(input.name)},</p>
<p>Someone has given a wrong password for your Synledger account <strong>${escapeHtml(input.to)}</strong> ${input.failures} times in the last ${input.windowMinutes} minutes, from ${escapeHtml(from)}.</p>
<p>If that was you, there is nothing to do: you can still sign in. Further attempts are slowed down for a while.</p>
<p>If it was not you, <a href="${escapeHtml(link)}">change your password and end your other sessions</a>.</p>
<p style="color:#555">Synledger never asks for your password by e-mail.</p>`;
  return { to: input.to, subject: "Unsuccessful sign-in attempts on your Synledger account", text, html };
}
