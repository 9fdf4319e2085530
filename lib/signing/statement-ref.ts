/**
 * The statement id travels inside the signature dictionary's /Reason, which is in the signed
 * byte range and stored uncompressed. Verification reads it back without trusting the rest of
 * the file, so even a damaged copy can still say which statement it claims to be.
 */
const PREFIX = "Synledger statement";
const REF = /Synledger statement ([0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12})/g;

export function statementReason(statementId: string, what: string): string {
  return `${PREFIX} ${statementId}: ${what}`;
}

/** Every statement id a PDF names in clear text, last (most recent signature) first. */
export function findStatementRefs(pdf: Buffer): string[] {
  const text = pdf.toString("latin1");
  const ids = [...text.matchAll(REF)].map((m) => m[1]);
  return [...new Set(ids.reverse())];
}
