import { createCipheriv, createDecipheriv, hkdfSync, randomBytes } from "node:crypto";
import { env } from "@/lib/env";

/**
 * (No "server-only" marker here so the demo seed, a plain tsx script, can seal too; app code
 * imports passphrase-box.ts, which carries the marker.)
 *
 * Seals certificate passphrases with AES-256-GCM. The key is derived (HKDF-SHA256) from
 * SIGNING_SECRET when set, else AUTH_SECRET. A separate SIGNING_SECRET is the better choice in
 * production: rotating AUTH_SECRET (to end all sessions) then does not make every stored
 * passphrase unreadable. The certificate fingerprint is bound in as associated data, so a
 * sealed passphrase copied onto another certificate row fails to open.
 */
const VERSION = "v1";

function key(secret?: string): Buffer {
  const s = secret ?? env().SIGNING_SECRET ?? env().AUTH_SECRET ?? "";
  if (s.length < 32) throw new Error("SIGNING_SECRET or AUTH_SECRET (at least 32 characters) is needed to seal passphrases");
  return Buffer.from(hkdfSync("sha256", s, "synledger", "signing-certificate-passphrase", 32));
}

export function sealPassphrase(passphrase: string, fingerprint: string, secret?: string): string {
  const iv = randomBytes(12);
  const cipher = createCipheriv("aes-256-gcm", key(secret), iv);
  cipher.setAAD(Buffer.from(fingerprint));
  const body = Buffer.concat([cipher.update(passphrase, "utf8"), cipher.final()]);
  return [VERSION, iv, cipher.getAuthTag(), body].map((p) => (typeof p === "string" ? p : p.toString("base64url"))).join(".");
}

export function openPassphrase(sealed: string, fingerprint: string, secret?: string): string {
  const [version, iv, tag, body] = sealed.split(".");
  if (version !== VERSION || !iv || !tag || body === undefined) throw new Error("Unrecognised sealed passphrase format");
  const decipher = createDecipheriv("aes-256-gcm", key(secret), Buffer.from(iv, "base64url"));
  decipher.setAAD(Buffer.from(fingerprint));
  decipher.setAuthTag(Buffer.from(tag, "base64url"));
  return Buffer.concat([decipher.update(Buffer.from(body, "base64url")), decipher.final()]).toString("utf8");
}
