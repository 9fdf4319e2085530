/**
 * The app's settings from the environment, checked with zod: the one reader of `process.env` in
 * the app and its scripts (tool configs — next.config.ts, drizzle.config.ts — and Next's own
 * NEXT_RUNTIME excepted). `server.ts` calls `requireServerEnv()` before it listens, so a missing
 * or malformed setting stops the start with the variable's name instead of failing a request.
 *
 * An empty value counts as unset, as the shell scripts write them.
 */
import { z } from "zod";
import { blankIsAbsent } from "./validations/blank";

const text = () => z.preprocess(blankIsAbsent, z.string().optional());
const url = (name: string) => z.preprocess(blankIsAbsent, z.url({ error: `${name} must be a URL` }).optional());
const whole = (name: string, fallback: number, min = 0) =>
  z.preprocess(blankIsAbsent, z.coerce.number({ error: `${name} must be a whole number` }).int(`${name} must be a whole number`).min(min, `${name} must be at least ${min}`).default(fallback));
const secret = (name: string) => z.preprocess(blankIsAbsent, z.string().min(32, `${name} must be at least 32 characters`).optional());

const schema = z.object({
  DATABASE_URL: text(),
  MIGRATION_DATABASE_URL: text(),
  /** CA of a managed PostgreSQL's certificate: connections then use sslmode=verify-full (db/client.ts). */
  DATABASE_CA_FILE: text(),
  DB_POOL_MAX: whole("DB_POOL_MAX", 10, 1),
  DB_STATEMENT_TIMEOUT_MS: whole("DB_STATEMENT_TIMEOUT_MS", 120_000),
  DB_IDLE_IN_TRANSACTION_MS: whole("DB_IDLE_IN_TRANSACTION_MS", 300_000),
  AUTH_SECRET: secret("AUTH_SECRET"),
  /** Seals signing-certificate passphrases; AUTH_SECRET when unset (lib/signing/passphrase-crypto.ts). */
  SIGNING_SECRET: secret("SIGNING_SECRET"),
  /** The public address: links in e-mails, the same-origin check, the API token page. */
  APP_URL: url("APP_URL"),
  AUTH_URL: url("AUTH_URL"),
  SMTP_URL: text(),
  MAIL_FROM: z.preprocess(blankIsAbsent, z.string().default("Synledger <no-reply@synledger.invalid>")),
  /** "0" keeps this instance from delivering the outbox (another one does). */
  MAIL_WORKER: z.preprocess(blankIsAbsent, z.enum(["0", "1"], { error: "MAIL_WORKER must be 0 or 1" }).default("1")),
  MAIL_WORKER_INTERVAL_MS: whole("MAIL_WORKER_INTERVAL_MS", 15_000, 100),
  PORT: whole("PORT", 3000, 1),
  HOST: z.preprocess(blankIsAbsent, z.string().default("0.0.0.0")),
  /** Addresses or CIDR ranges of the proxies whose forwarding headers are believed (lib/net/forwarded.ts). */
  TRUSTED_PROXY: text(),
});

export type Env = z.output<typeof schema>;
const KEYS = Object.keys(schema.shape) as (keyof Env)[];

export class EnvError extends Error {}

let cached: { raw: string; env: Env } | null = null;

/** The settings now; parsed again only when one of their raw values changed. Throws EnvError naming every bad one. */
export function env(): Env {
  const values = KEYS.map((k) => process.env[k]);
  const raw = JSON.stringify(values);
  if (cached?.raw === raw) return cached.env;
  const r = schema.safeParse(Object.fromEntries(KEYS.map((k, i) => [k, values[i]])));
  if (!r.success) throw new EnvError(`Settings in the environment are not valid: ${r.error.issues.map((i) => i.message).join("; ")}`);
  cached = { raw, env: r.data };
  return r.data;
}

/** The public base address without a trailing slash. */
export function appUrl(): string {
  const e = env();
  return (e.APP_URL ?? e.AUTH_URL ?? "http://localhost:3000").replace(/\/+$/, "");
}

/** What a serving instance cannot start without; the message names each missing setting. */
export function requireServerEnv(): Env {
  const e = env();
  const missing = [!e.DATABASE_URL && "DATABASE_URL", !e.AUTH_SECRET && "AUTH_SECRET"].filter(Boolean);
  if (missing.length) throw new EnvError(`Settings missing from the environment: ${missing.join(", ")} (npm start sets them; see README, "Deployment at scale").`);
  return e;
}
