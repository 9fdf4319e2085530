import { and, desc, eq, isNull, sql } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { apiTokens, sites, users } from "../schema";

export interface NewApiToken {
  organisationId: string;
  siteId: string;
  label: string;
  prefix: string;
  tokenHash: string;
  createdBy: string;
}

export async function createApiToken(tx: Db | Tx, values: NewApiToken) {
  const [row] = await tx.insert(apiTokens).values(values).returning({ id: apiTokens.id, createdAt: apiTokens.createdAt });
  return row;
}

/** The token a request presents, with its site, only while it is not revoked. */
export async function findActiveToken(db: Db | Tx, tokenHash: string) {
  const [row] = await db
    .select({
      id: apiTokens.id,
      organisationId: apiTokens.organisationId,
      siteId: apiTokens.siteId,
      label: apiTokens.label,
      scope: apiTokens.scope,
      lastUsedAt: apiTokens.lastUsedAt,
    })
    .from(apiTokens)
    .where(and(eq(apiTokens.tokenHash, tokenHash), isNull(apiTokens.revokedAt)))
    .limit(1);
  return row ?? null;
}

export async function touchApiToken(db: Db | Tx, id: string, at = new Date()): Promise<void> {
  await db.update(apiTokens).set({ lastUsedAt: at }).where(eq(apiTokens.id, id));
}

/** Every token of the organisation, newest first, with its site and who made it; never the hash. */
export async function listApiTokens(db: Db | Tx, organisationId: string) {
  return db
    .select({
      id: apiTokens.id,
      label: apiTokens.label,
      prefix: apiTokens.prefix,
      scope: apiTokens.scope,
      siteId: apiTokens.siteId,
      siteName: sites.name,
      createdByName: users.name,
      createdAt: apiTokens.createdAt,
      lastUsedAt: apiTokens.lastUsedAt,
      revokedAt: apiTokens.revokedAt,
    })
    .from(apiTokens)
    .innerJoin(sites, eq(sites.id, apiTokens.siteId))
    .leftJoin(users, eq(users.id, apiTokens.createdBy))
    .where(eq(apiTokens.organisationId, organisationId))
    .orderBy(desc(apiTokens.createdAt));
}

/** Locks one token of the organisation for a revocation; another organisation's id gives null. */
export async function lockApiToken(tx: Tx, organisationId: string, id: string) {
  const [row] = await tx
    .select({ id: apiTokens.id, label: apiTokens.label, prefix: apiTokens.prefix, siteId: apiTokens.siteId, revokedAt: apiTokens.revokedAt })
    .from(apiTokens)
    .where(and(eq(apiTokens.id, id), eq(apiTokens.organisationId, organisationId)))
    .for("update");
  return row ?? null;
}

export async function revokeApiToken(tx: Tx, id: string, at = new Date()): Promise<void> {
  await tx.update(apiTokens).set({ revokedAt: at }).where(eq(apiTokens.id, id));
}

/** Whether an active token of the site already carries the label (compared ignoring case). */
export async function activeLabelTaken(db: Db | Tx, siteId: string, label: string): Promise<boolean> {
  const [row] = await db
    .select({ id: apiTokens.id })
    .from(apiTokens)
    .where(and(eq(apiTokens.siteId, siteId), isNull(apiTokens.revokedAt), sql`lower(${apiTokens.label}) = lower(${label})`))
    .limit(1);
  return !!row;
}
