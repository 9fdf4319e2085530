/**
 * Bounds of one plant-month, in one place for the CLI, the REST API, the month form and every
 * import. They lie far beyond any real plant (a large site meters a few dozen streams and takes
 * a handful of analyses a month) and close to what one request may cost the server: 6 000
 * streams took 2.3 s of engine time, which is a way to starve everyone else.
 */
export const LIMITS = {
  /** Streams (readings) in one month. */
  streams: 200,
  /** Gas analyses in one month. */
  analyses: 50,
  /** A plant-month file or request body, in bytes of UTF-8. */
  fileBytes: 1024 * 1024,
  /** A note on a reading, an analysis, a stream or the month. */
  noteChars: 2000,
  /** A number written as text (digits, sign, point and exponent). */
  numberChars: 100,
  /** A stream id, analysis key, meter or site name in a file. */
  nameChars: 200,
} as const;

/** UTF-8 length of a string without encoding it (lone surrogates count as the 3 bytes of U+FFFD). */
export function utf8Length(text: string): number {
  let n = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) n += 1;
    else if (c < 0x800) n += 2;
    else if (c >= 0xd800 && c <= 0xdbff && i + 1 < text.length && (text.charCodeAt(i + 1) & 0xfc00) === 0xdc00) {
      n += 4;
      i++;
    } else n += 3;
  }
  return n;
}

export const tooLargeReason = (bytes: number) =>
  `the document is ${bytes} bytes, more than the ${LIMITS.fileBytes} bytes (1 MiB) a plant-month may take; send one month per file`;
