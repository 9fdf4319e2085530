import type { Metadata } from "next";
import { Status } from "@/components/ui/status";
import { pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { listCertificates } from "@/db/queries/statements";
import { requirePageActor } from "@/lib/auth/guard";
import { utcStamp } from "@/reports/format";
import { activate, uploadCertificate } from "./actions";
import { ActivateButton, UploadForm } from "./_components/certificate-forms";
import { SettingsTabs } from "../settings-tabs";

export const metadata: Metadata = { title: "Signing certificate" };

/** Administrator: the PKCS#12 certificates the organisation signs statements with. */
export default async function SigningSettingsPage() {
  const actor = await requirePageActor("site:manage");
  const certs = await listCertificates(getDb(), actor.organisationId);
  const now = new Date();
  return (
    <div className="max-w-4xl space-y-6">
      <div>
        <h1 className={pageTitle}>Settings</h1>
        <SettingsTabs current="signing" />
        <p className="mt-3 max-w-prose text-ink-soft">
          Signed statements are sealed with the organisation&rsquo;s active certificate. Upload the PKCS#12 file (.p12 or .pfx) your
          certificate authority issued; its passphrase is stored encrypted, never in clear. Statements already signed keep the
          certificate they were signed with.
        </p>
      </div>
      <section aria-labelledby="certs" className="space-y-2">
        <h2 id="certs" className="text-base font-semibold">
          Certificates
        </h2>
        {certs.length === 0 ? <p className="text-ink-soft">No certificate yet: nobody can sign until one is uploaded and active.</p> : null}
        <ul className="space-y-2">
          {certs.map((c) => (
            <li key={c.id} className={`border px-4 py-3 ${c.active ? "border-accent bg-accent-wash/40" : "border-rule bg-white"}`}>
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <p className="font-medium">{c.label}</p>
                {c.active ? <Status tone="ok">Active: signs new statements</Status> : c.validTo < now ? <Status tone="fault">Expired</Status> : <Status tone="pending">Stored, not active</Status>}
              </div>
              <p className="text-sm">{c.subject}</p>
              <p className="num text-xs text-ink-soft">
                valid {utcStamp(c.validFrom)} to {utcStamp(c.validTo)}
              </p>
              <p className="num break-all text-xs text-ink-faint">SHA-256 fingerprint {c.fingerprintSha256}</p>
              {!c.active && c.validTo >= now ? <ActivateButton action={activate} certificateId={c.id} label={c.label} /> : null}
            </li>
          ))}
        </ul>
      </section>
      <section aria-labelledby="upload" className="space-y-2">
        <h2 id="upload" className="text-base font-semibold">
          Upload a certificate
        </h2>
        <UploadForm action={uploadCertificate} />
      </section>
    </div>
  );
}
