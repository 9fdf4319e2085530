import "server-only";
import { createHash, randomBytes } from "node:crypto";

/** Every token starts so; secret scanners and people can tell a Synledger token at a glance. */
export const TOKEN_PREFIX = "syl_";
/** How many leading characters are kept in clear, enough to tell tokens apart, far too few to guess the rest. */
const SHOWN_CHARS = 12;

export function hashApiToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

/** A new secret: shown once to the administrator; the database keeps only its SHA-256 and prefix. */
export function newApiToken(): { token: string; tokenHash: string; prefix: string } {
  const token = `${TOKEN_PREFIX}${randomBytes(32).toString("base64url")}`;
  return { token, tokenHash: hashApiToken(token), prefix: token.slice(0, SHOWN_CHARS) };
}
