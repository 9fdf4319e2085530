import type { Metadata } from "next";
import { pageTitle } from "@/components/ui/styles";
import { verifyAction } from "./actions";
import { VerifyDrop } from "./_components/verify-drop";

export const metadata: Metadata = { title: "Verify a statement" };

/** Anyone holding a copy of a statement can check it here, without an account. */
export default function VerifyPage() {
  return (
    <div className="max-w-3xl space-y-4">
      <h1 className={pageTitle}>Verify a statement</h1>
      <p className="text-ink-soft">
        Check a greenhouse-gas statement signed in Synledger: choose or drop the PDF. It is hashed and compared with the stored statements on
        the server and then forgotten; it is not kept. You need no account. Scripts can send the file to <span className="num">POST /api/v1/verify</span>.
      </p>
      <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[7rem_1fr]">
        <dt className="font-semibold">Issued</dt>
        <dd className="text-ink-soft">byte for byte a stored statement, and the latest revision of its period.</dd>
        <dt className="font-semibold">Superseded</dt>
        <dd className="text-ink-soft">byte for byte a stored statement, but a later revision replaced it; you are told which.</dd>
        <dt className="font-semibold">Altered</dt>
        <dd className="text-ink-soft">it names a stored statement or carries a signature Synledger made, but its bytes changed after signing.</dd>
        <dt className="font-semibold">Unknown</dt>
        <dd className="text-ink-soft">nothing in it points at a statement signed in Synledger.</dd>
      </dl>
      <VerifyDrop action={verifyAction} />
      <p className="text-xs text-ink-soft">
        You see what the statement itself makes public: the installation, the period, the kind and revision, who signed it and when, and its key
        figures. Nothing else of the operator is shown. Up to 30 checks a minute from one address.
      </p>
    </div>
  );
}
