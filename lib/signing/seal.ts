import { pdflibAddPlaceholder } from "@signpdf/placeholder-pdf-lib";
import { P12Signer } from "@signpdf/signer-p12";
import { SignPdf } from "@signpdf/signpdf";
import { PDFDocument } from "pdf-lib";

export interface SealDetails {
  reason: string;
  location: string;
  name: string;
  contactInfo: string;
  /** Defaults to now; the same instant goes into the dictionary (/M) and the PKCS#7. */
  signingTime?: Date;
}

/**
 * Adds a signature field and dictionary with pdf-lib (@signpdf/placeholder-pdf-lib: the widget
 * gets an appearance stream and the file keeps its trailer ID, both needed for PDF/A) and fills
 * it with a detached PKCS#7 (SHA-256) made with the PKCS#12 key. The placeholder is written in
 * a full save with a classic cross-reference table, so nothing is appended after signing.
 */
export async function sealPdf(pdf: Buffer, p12: Buffer, passphrase: string, details: SealDetails): Promise<Buffer> {
  const signingTime = details.signingTime ?? new Date();
  const doc = await PDFDocument.load(pdf, { updateMetadata: false });
  pdflibAddPlaceholder({
    pdfDoc: doc,
    reason: details.reason,
    location: details.location,
    name: details.name,
    contactInfo: details.contactInfo,
    signingTime,
    appName: "Synledger",
  });
  const withPlaceholder = Buffer.from(await doc.save({ useObjectStreams: false, updateFieldAppearances: false }));
  return new SignPdf().sign(withPlaceholder, new P12Signer(p12, { passphrase }), signingTime);
}
