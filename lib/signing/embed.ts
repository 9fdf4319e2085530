/**
 * Files carried inside a statement PDF (ISO 32000-1, 7.11.4 "Embedded file streams": a file
 * specification in the document's EmbeddedFiles name tree, with the file's media type as the
 * stream's /Subtype). The signed statement carries the plant-month document and the result
 * document it was rendered from, so anyone holding the PDF can recompute it.
 */
import { applyPdfA3 } from "./pdfa";
import { AFRelationship, decodePDFRawStream, PDFArray, PDFDict, PDFDocument, PDFHexString, PDFName, PDFRawStream, PDFString } from "pdf-lib";

export interface EmbeddedFile {
  name: string;
  mediaType: string;
  description: string;
  bytes: Uint8Array;
}

/**
 * Attaches the files, makes the document PDF/A-3b (lib/signing/pdfa.ts) and writes it with a
 * classic cross-reference table (what the signature placeholder needs). The title, author and
 * subject react-pdf wrote are carried into the XMP metadata.
 */
export async function embedFiles(pdf: Buffer, files: EmbeddedFile[], when: Date, language = "en-GB"): Promise<Buffer> {
  const doc = await PDFDocument.load(pdf, { updateMetadata: false });
  for (const f of files) {
    await doc.attach(f.bytes, f.name, { mimeType: f.mediaType, description: f.description, creationDate: when, modificationDate: when, afRelationship: AFRelationship.Source });
  }
  applyPdfA3(doc, { title: doc.getTitle() ?? "Synledger statement", author: doc.getAuthor() ?? "Synledger", subject: doc.getSubject() ?? "", language, created: when });
  return Buffer.from(await doc.save({ useObjectStreams: false, updateFieldAppearances: false }));
}

const text = (v: unknown): string | null => (v instanceof PDFString || v instanceof PDFHexString ? v.decodeText() : null);

/** The files a PDF carries, by name; an empty list when it carries none. Throws on a file that is not a PDF. */
export async function readEmbeddedFiles(pdf: Uint8Array): Promise<{ name: string; mediaType: string | null; bytes: Uint8Array }[]> {
  const doc = await PDFDocument.load(pdf, { updateMetadata: false, ignoreEncryption: true });
  const names = doc.catalog.lookupMaybe(PDFName.of("Names"), PDFDict);
  const tree = names?.lookupMaybe(PDFName.of("EmbeddedFiles"), PDFDict);
  if (!tree) return [];
  const out: { name: string; mediaType: string | null; bytes: Uint8Array }[] = [];
  const visit = (node: PDFDict, depth: number) => {
    if (depth > 16) return;
    const pairs = node.lookupMaybe(PDFName.of("Names"), PDFArray);
    if (pairs) {
      for (let i = 0; i + 1 < pairs.size(); i += 2) {
        const spec = pairs.lookupMaybe(i + 1, PDFDict);
        const ef = spec?.lookupMaybe(PDFName.of("EF"), PDFDict);
        const stream = ef?.lookup(PDFName.of("F"));
        if (!(stream instanceof PDFRawStream)) continue;
        const subtype = stream.dict.lookupMaybe(PDFName.of("Subtype"), PDFName);
        out.push({
          name: text(spec?.lookup(PDFName.of("UF"))) ?? text(spec?.lookup(PDFName.of("F"))) ?? text(pairs.lookup(i)) ?? "unnamed",
          mediaType: subtype ? subtype.decodeText() : null,
          bytes: decodePDFRawStream(stream).decode(),
        });
      }
    }
    const kids = node.lookupMaybe(PDFName.of("Kids"), PDFArray);
    if (kids) for (let i = 0; i < kids.size(); i++) {
      const kid = kids.lookupMaybe(i, PDFDict);
      if (kid) visit(kid, depth + 1);
    }
  };
  visit(tree, 0);
  return out;
}
