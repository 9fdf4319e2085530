/**
 * What turns react-pdf's output into PDF/A-3b (ISO 19005-3, conformance level B) before it is
 * signed, done with pdf-lib on the loaded document:
 * - PDF 1.7 header (react-pdf writes 1.3) and a document ID in the trailer;
 * - an XMP metadata stream (uncompressed, in the catalog) with the PDF/A identification
 *   (pdfaid:part 3, conformance B) and the title, author, subject, creator, producer and dates,
 *   the same values as the document information dictionary;
 * - an output intent with the sRGB IEC 61966-2.1 ICC profile (shipped with pdfkit, a dependency
 *   of react-pdf: node_modules/pdfkit/js/data/sRGB_IEC61966_2_1.icc);
 * - the document language (/Lang).
 * The fonts are already embedded by react-pdf (IBM Plex subsets, reports/fonts.ts); embedded
 * files carry /AFRelationship and are listed in the catalog's /AF (pdf-lib's attach does it).
 * Signing comes after (lib/signing/seal.ts) as an incremental update, which PDF/A allows.
 */
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import path from "node:path";
import { PDFArray, PDFDocument, PDFHeader, PDFHexString, PDFName, PDFRawStream, PDFString } from "pdf-lib";

export interface PdfAFacts {
  title: string;
  author: string;
  subject: string;
  /** BCP 47 tag, e.g. "en-GB". */
  language: string;
  created: Date;
}

let icc: Buffer | null = null;
function srgbProfile(): Buffer {
  icc ??= readFileSync(path.join(process.cwd(), "node_modules", "pdfkit", "js", "data", "sRGB_IEC61966_2_1.icc"));
  return icc;
}

const escapeXml = (s: string) => s.replaceAll("&", "&amp;").replaceAll("<", "&lt;").replaceAll(">", "&gt;").replaceAll('"', "&quot;");
/** XMP dates: ISO 8601 with seconds and "Z". */
const xmpDate = (d: Date) => `${d.toISOString().slice(0, 19)}Z`;

export function xmpPacket(f: PdfAFacts): string {
  const t = escapeXml(f.title);
  return `<?xpacket begin="\uFEFF" id="W5M0MpCehiHzreSzNTczkc9d"?>
<x:xmpmeta xmlns:x="adobe:ns:meta/">
 <rdf:RDF xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#">
  <rdf:Description rdf:about="" xmlns:pdfaid="http://www.aiim.org/pdfa/ns/id/">
   <pdfaid:part>3</pdfaid:part>
   <pdfaid:conformance>B</pdfaid:conformance>
  </rdf:Description>
  <rdf:Description rdf:about="" xmlns:dc="http://purl.org/dc/elements/1.1/">
   <dc:format>application/pdf</dc:format>
   <dc:title><rdf:Alt><rdf:li xml:lang="x-default">${t}</rdf:li></rdf:Alt></dc:title>
   <dc:creator><rdf:Seq><rdf:li>${escapeXml(f.author)}</rdf:li></rdf:Seq></dc:creator>
   <dc:description><rdf:Alt><rdf:li xml:lang="x-default">${escapeXml(f.subject)}</rdf:li></rdf:Alt></dc:description>
   <dc:language><rdf:Bag><rdf:li>${escapeXml(f.language)}</rdf:li></rdf:Bag></dc:language>
  </rdf:Description>
  <rdf:Description rdf:about="" xmlns:xmp="http://ns.adobe.com/xap/1.0/">
   <xmp:CreatorTool>Synledger</xmp:CreatorTool>
   <xmp:CreateDate>${xmpDate(f.created)}</xmp:CreateDate>
   <xmp:ModifyDate>${xmpDate(f.created)}</xmp:ModifyDate>
   <xmp:MetadataDate>${xmpDate(f.created)}</xmp:MetadataDate>
  </rdf:Description>
  <rdf:Description rdf:about="" xmlns:pdf="http://ns.adobe.com/pdf/1.3/">
   <pdf:Producer>Synledger</pdf:Producer>
  </rdf:Description>
 </rdf:RDF>
</x:xmpmeta>
<?xpacket end="w"?>`;
}

/** Makes the loaded document PDF/A-3b; save it with a classic cross-reference table afterwards. */
export function applyPdfA3(doc: PDFDocument, f: PdfAFacts): void {
  const ctx = doc.context;
  ctx.header = PDFHeader.forVersion(1, 7);

  // The information dictionary and the XMP must say the same (ISO 19005-3, 6.6.2.3).
  doc.setTitle(f.title);
  doc.setAuthor(f.author);
  doc.setSubject(f.subject);
  doc.setCreator("Synledger");
  doc.setProducer("Synledger");
  doc.setCreationDate(f.created);
  doc.setModificationDate(f.created);
  doc.setLanguage(f.language);
  // Keywords are not in the XMP above, so none may be in the information dictionary either.
  const info = ctx.lookup(ctx.trailerInfo.Info);
  if (info && "delete" in info && typeof info.delete === "function") info.delete(PDFName.of("Keywords"));

  // Uncompressed, so any reader (and any XMP scanner) finds the packet.
  const xmp = Buffer.from(xmpPacket(f), "utf8");
  const raw = PDFRawStream.of(ctx.obj({ Type: "Metadata", Subtype: "XML", Length: xmp.length }), xmp);
  doc.catalog.set(PDFName.of("Metadata"), ctx.register(raw));

  const profile = srgbProfile();
  const iccStream = ctx.flateStream(profile, { N: 3 });
  const intent = ctx.obj({
    Type: "OutputIntent",
    S: "GTS_PDFA1",
    OutputConditionIdentifier: PDFString.of("sRGB IEC61966-2.1"),
    Info: PDFString.of("sRGB IEC61966-2.1"),
    RegistryName: PDFString.of("http://www.color.org"),
    DestOutputProfile: ctx.register(iccStream),
  });
  doc.catalog.set(PDFName.of("OutputIntents"), ctx.obj([ctx.register(intent)]));

  // A document ID (two equal 16-byte strings for a new file), derived from what the file is.
  const id = createHash("sha256").update(`${f.title}|${f.created.toISOString()}|${f.author}`).digest("hex").slice(0, 32);
  ctx.trailerInfo.ID = ctx.obj([PDFHexString.of(id), PDFHexString.of(id)]) as PDFArray;
}
