import type { Metadata } from "next";
import { headers } from "next/headers";
import Link from "next/link";
import { Notice } from "@/components/ui/status";
import { link, pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { laterRevisionOf, statementById } from "@/db/queries/statements";
import { publicFacts } from "@/lib/lifecycle/verification-answer";
import { kindLabelOf } from "@/lib/statement-kind";
import { clientAddressOf } from "@/lib/net/forwarded";
import { countRequest, VERIFY_LIMIT } from "@/lib/net/rate-limit";
import { verifyAction } from "../actions";
import { FactsList, VerifyDrop } from "../_components/verify-drop";

export const metadata: Metadata = { title: "Statement record" };

const REF = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

/**
 * The public record of one statement, as the reference printed in its PDF opens it: what was
 * signed, by whom and when, whether a later revision replaced it, and the SHA-256 a copy must
 * have. Checking a copy's bytes needs the file itself (the form below).
 */
export default async function StatementRecordPage({ params }: { params: Promise<{ ref: string }> }) {
  const { ref } = await params;
  const rate = await countRequest(getDb(), VERIFY_LIMIT.bucket, clientAddressOf(await headers()), VERIFY_LIMIT.perMinute);
  if (!rate.allowed) {
    return (
      <Notice tone="warn" title="Too many checks from your address this minute">
        The limit is {rate.limit} a minute; try again in {rate.retryAfterSeconds} seconds.
      </Notice>
    );
  }
  const reference = ref.toLowerCase();
  const stored = REF.test(reference) ? await statementById(getDb(), { anyOrganisation: true }, reference) : null;
  if (!stored) {
    return (
      <div className="max-w-3xl space-y-4">
        <h1 className={pageTitle}>No statement has this reference</h1>
        <p className="text-ink-soft">
          Check the reference printed at the foot of the statement&rsquo;s pages, or <Link className={link} href="/verify">check the PDF file itself</Link>.
        </p>
      </div>
    );
  }
  const later = await laterRevisionOf(getDb(), stored);
  const s = publicFacts(stored);
  const n = later ? publicFacts(later) : null;
  return (
    <div className="max-w-3xl space-y-4">
      <p className="num text-sm text-ink-soft">Reference {s.reference}</p>
      <h1 className={pageTitle}>
        {kindLabelOf(s.kind)}{s.kind === "cbam" ? "" : " statement"} of {s.installation}, {s.periodLabel}
      </h1>
      {n ? (
        <Notice tone="warn" title={`Superseded by revision ${n.revision}`}>
          Revision {s.revision} was replaced on {n.signedAtText}. Rely on <Link className={link} href={`/verify/${n.reference}`}>revision {n.revision}</Link>.
        </Notice>
      ) : (
        <Notice tone="ok" title={`Revision ${s.revision} is the latest revision of this period`}>
          Signed by {s.signer} ({s.signerRole}) on {s.signedAtText}.
        </Notice>
      )}
      <FactsList s={s} figures />
      <section aria-labelledby="check-copy" className="space-y-2">
        <h2 id="check-copy" className="text-base font-semibold">
          Check your copy
        </h2>
        <p className="text-sm text-ink-soft">This record says what was signed; only the file shows whether your copy is that file. Its SHA-256 must be the one above.</p>
        <VerifyDrop action={verifyAction} />
      </section>
    </div>
  );
}
