import { plainAddPlaceholder } from "@signpdf/placeholder-plain";
import { P12Signer } from "@signpdf/signer-p12";
import { SignPdf } from "@signpdf/signpdf";

export interface SealDetails {
  reason: string;
  location: string;
  name: string;
  contactInfo: string;
  /** Defaults to now; the same instant goes into the dictionary (/M) and the PKCS#7. */
  signingTime?: Date;
}

/**
 * Adds a signature dictionary to a PDF made by react-pdf (classic xref table, which the plain
 * placeholder needs) and fills it with a detached PKCS#7 (SHA-256) made with the PKCS#12 key.
 */
export async function sealPdf(pdf: Buffer, p12: Buffer, passphrase: string, details: SealDetails): Promise<Buffer> {
  const signingTime = details.signingTime ?? new Date();
  const withPlaceholder = plainAddPlaceholder({
    pdfBuffer: pdf,
    reason: details.reason,
    location: details.location,
    name: details.name,
    contactInfo: details.contactInfo,
    signingTime,
    appName: "Synledger",
  });
  return new SignPdf().sign(withPlaceholder, new P12Signer(p12, { passphrase }), signingTime);
}
