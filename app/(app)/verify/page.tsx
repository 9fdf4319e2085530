import type { Metadata } from "next";
import { pageTitle } from "@/components/ui/styles";
import { requirePageActor } from "@/lib/auth/guard";
import { verifyAction } from "./actions";
import { VerifyDrop } from "./_components/verify-drop";

export const metadata: Metadata = { title: "Verify a statement" };

/** Anyone signed in, auditors included, can check a PDF against the organisation's signed statements. */
export default async function VerifyPage() {
  const actor = await requirePageActor();
  return (
    <div className="max-w-3xl space-y-4">
      <h1 className={pageTitle}>Verify a statement</h1>
      <p className="text-ink-soft">
        Drop a statement PDF here to check it against the statements signed for {actor.organisationName.replace(/\.$/, "")}. The file is hashed and
        compared on the server and then forgotten; it is not stored. Scripts can use POST /api/v1/verify.
      </p>
      <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[6rem_1fr]">
        <dt className="font-semibold">Issued</dt>
        <dd className="text-ink-soft">byte for byte a statement we signed and stored; you see which one and who signed it.</dd>
        <dt className="font-semibold">Altered</dt>
        <dd className="text-ink-soft">it claims to be one of ours, or carries our signature, but its bytes changed after signing.</dd>
        <dt className="font-semibold">Unknown</dt>
        <dd className="text-ink-soft">nothing in it points at a statement of this organisation.</dd>
      </dl>
      <VerifyDrop action={verifyAction} />
    </div>
  );
}
