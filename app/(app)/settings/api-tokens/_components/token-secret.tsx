"use client";

import { useState } from "react";
import { Notice } from "@/components/ui/status";
import { buttonSecondary } from "@/components/ui/styles";
import type { CreatedToken } from "../actions";

/** The new secret with a copy button and a ready request; it lives only in this page's memory. */
export function TokenSecret({ created, appUrl }: { created: CreatedToken; appUrl: string }) {
  const [copied, setCopied] = useState(false);
  const example = [
    `curl -X PUT ${appUrl}/api/v1/sites/${created.siteId}/months/2026-03/readings/<stream>`,
    `  -H "Authorization: Bearer ${created.token}"`,
    `  -H "Content-Type: application/json"`,
    `  -d '{"quantity": "43763.5", "unit": "t"}'`,
  ].join(" \\\n");
  async function copy() {
    await navigator.clipboard.writeText(created.token);
    setCopied(true);
  }
  return (
    <Notice tone="ok" title={`Token "${created.label}" for ${created.siteName}`}>
      <p className="text-sm">Copy it now: it is shown only this once. Synledger keeps only a fingerprint and cannot show it again.</p>
      <div className="mt-2 flex flex-wrap items-center gap-2">
        <code className="num break-all border border-rule-strong bg-white px-2 py-1 text-sm select-all" aria-label="New API token">
          {created.token}
        </code>
        <button type="button" className={`${buttonSecondary} px-2 py-1 text-xs`} onClick={copy}>
          {copied ? "Copied" : "Copy"}
        </button>
      </div>
      <details className="mt-2 text-sm">
        <summary className="cursor-pointer text-ink-soft">Example: send one monthly total</summary>
        <pre className="num mt-1 overflow-x-auto border border-rule bg-white px-2 py-1.5 text-xs">{example}</pre>
      </details>
    </Notice>
  );
}
