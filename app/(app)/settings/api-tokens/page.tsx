import type { Metadata } from "next";
import { EmptyState } from "@/components/ui/empty-state";
import { formatDate, formatDateTime } from "@/reports/format";
import { Status } from "@/components/ui/status";
import { link, pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { listApiTokens } from "@/db/queries/api-tokens";
import { listSites } from "@/db/queries/sites";
import { requirePageActor } from "@/lib/auth/guard";
import { CreateTokenForm } from "./_components/create-token-form";
import { RevokeTokenForm } from "./_components/revoke-token-form";
import { SettingsTabs } from "../settings-tabs";
import { appUrl } from "@/lib/env";

export const metadata: Metadata = { title: "API tokens" };

export default async function ApiTokensPage() {
  const actor = await requirePageActor("site:manage");
  const db = getDb();
  const [tokens, sites] = await Promise.all([listApiTokens(db, actor.organisationId), listSites(db, actor.organisationId)]);
  const base = appUrl();

  return (
    <div className="space-y-8">
      <div>
        <h1 className={pageTitle}>Settings</h1>
        <SettingsTabs current="api-tokens" />
      </div>

      <section aria-labelledby="create-heading" className="border border-rule bg-white px-4 py-4">
        <h2 id="create-heading" className="text-base font-semibold">
          Create a token for a plant system
        </h2>
        <p className="mt-0.5 mb-3 max-w-prose text-sm text-ink-soft">
          A token belongs to one site. It may write that site&rsquo;s monthly readings and read its list of streams, nothing else: no
          analyses, results or other sites. Changes it makes are recorded in the audit trail under its label. The API is described at{" "}
          <a className={link} href="/api/v1/openapi.json">
            /api/v1/openapi.json
          </a>
          .
        </p>
        {sites.length === 0 ? (
          <p className="text-sm">Set up a site first (Sites and meters); tokens are made per site.</p>
        ) : (
          <CreateTokenForm sites={sites.map((s) => ({ id: s.id, name: s.name }))} appUrl={base} />
        )}
      </section>

      <section aria-labelledby="tokens-heading">
        <h2 id="tokens-heading" className="text-base font-semibold">
          Tokens of {actor.organisationName} <span className="num font-normal text-ink-soft">({tokens.length})</span>
        </h2>
        {tokens.length === 0 ? (
          <div className="mt-3">
            <EmptyState title="No API tokens yet">
              <p>Tokens you create appear here with their site, when they were last used, and a button to revoke them.</p>
            </EmptyState>
          </div>
        ) : (
          <div className="relative mt-3 overflow-x-auto border border-rule bg-white" role="region" aria-label="API tokens" tabIndex={0}>
            <table className="w-full text-left text-sm">
              <thead className="border-b border-rule bg-paper-deep text-xs uppercase tracking-wide text-ink-soft">
                <tr>
                  <th scope="col" className="px-3 py-2 font-medium">Label</th>
                  <th scope="col" className="px-3 py-2 font-medium">Site</th>
                  <th scope="col" className="px-3 py-2 font-medium">Starts with</th>
                  <th scope="col" className="px-3 py-2 font-medium">Created</th>
                  <th scope="col" className="px-3 py-2 font-medium">Last used</th>
                  <th scope="col" className="px-3 py-2 font-medium">State</th>
                  <th scope="col" className="px-3 py-2 font-medium"><span className="sr-only">Actions</span></th>
                </tr>
              </thead>
              <tbody className="divide-y divide-rule">
                {tokens.map((t) => (
                  <tr key={t.id} className={`align-top ${t.revokedAt ? "text-ink-soft" : ""}`}>
                    <td className="px-3 py-2 font-medium">{t.label}</td>
                    <td className="px-3 py-2">{t.siteName}</td>
                    <td className="num px-3 py-2 whitespace-nowrap">{t.prefix}…</td>
                    <td className="px-3 py-2 text-ink-soft">
                      <span className="num whitespace-nowrap">{formatDate(t.createdAt)}</span>
                      {t.createdByName ? <span className="block text-xs">by {t.createdByName}</span> : null}
                    </td>
                    <td className="num px-3 py-2 whitespace-nowrap text-ink-soft">{t.lastUsedAt ? formatDateTime(t.lastUsedAt) : "never"}</td>
                    <td className="px-3 py-2 whitespace-nowrap">
                      {t.revokedAt ? (
                        <>
                          <Status tone="fault">Revoked</Status>
                          <span className="num block text-xs text-ink-soft">{formatDate(t.revokedAt)}</span>
                        </>
                      ) : (
                        <Status tone="ok">Active</Status>
                      )}
                    </td>
                    <td className="px-3 py-2 text-right">{t.revokedAt ? null : <RevokeTokenForm tokenId={t.id} label={t.label} />}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
    </div>
  );
}
