/**
 * A tampered copy of a signed statement: one byte changed inside the range the signature covers
 * (the /ByteRange of the signature dictionary), so the digest no longer matches.
 */

/** The [start, length] pairs of the first signature's /ByteRange. */
export function signedRanges(pdf: Buffer): [number, number][] {
  const m = /\/ByteRange\s*\[\s*(\d+)\s+(\d+)\s+(\d+)\s+(\d+)\s*\]/.exec(pdf.toString("latin1"));
  if (!m) throw new Error("the PDF has no /ByteRange: it is not signed");
  const [a, b, c, d] = m.slice(1).map(Number);
  return [
    [a, b],
    [c, d],
  ];
}

/**
 * Changes one letter of `marker` (the first occurrence inside a signed range) and returns the
 * copy and the offset changed. The marker is text the statement prints, e.g. the site's name.
 */
export function tamperSignedByte(pdf: Buffer, marker: string): { bytes: Buffer; offset: number } {
  const ranges = signedRanges(pdf);
  const inside = (at: number) => ranges.some(([start, length]) => at >= start && at < start + length);
  for (let at = pdf.indexOf(marker); at >= 0; at = pdf.indexOf(marker, at + 1)) {
    if (!inside(at)) continue;
    const bytes = Buffer.from(pdf);
    bytes[at] = bytes[at] === 0x58 ? 0x59 : 0x58; // "X", or "Y" when it already is one
    return { bytes, offset: at };
  }
  throw new Error(`"${marker}" does not occur inside the signed range`);
}
