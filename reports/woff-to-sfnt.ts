import { inflateSync } from "node:zlib";

/**
 * Unpacks a WOFF 1.0 file into the plain TrueType/OpenType bytes it wraps. fontkit (inside
 * react-pdf) misreads glyph offsets in some WOFF files, IBM Plex Mono's among them ("Offset is
 * outside the bounds of the DataView"); the unpacked font reads fine. Format: W3C WOFF 1.0, §3–5.
 */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.readUInt32BE(0) !== 0x774f4646) throw new Error("not a WOFF 1.0 file");
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables: { tag: number; checksum: number; data: Buffer }[] = [];
  for (let i = 0; i < numTables; i++) {
    const e = 44 + i * 20;
    const offset = woff.readUInt32BE(e + 4);
    const compLength = woff.readUInt32BE(e + 8);
    const origLength = woff.readUInt32BE(e + 12);
    const raw = woff.subarray(offset, offset + compLength);
    const data = compLength < origLength ? inflateSync(raw) : Buffer.from(raw);
    if (data.length !== origLength) throw new Error("WOFF table length mismatch");
    tables.push({ tag: woff.readUInt32BE(e), checksum: woff.readUInt32BE(e + 16), data });
  }
  // The sfnt header's binary-search fields, as the OpenType spec defines them.
  const maxPow2 = 2 ** Math.floor(Math.log2(numTables));
  const head = Buffer.alloc(12 + numTables * 16);
  head.writeUInt32BE(flavor, 0);
  head.writeUInt16BE(numTables, 4);
  head.writeUInt16BE(maxPow2 * 16, 6);
  head.writeUInt16BE(Math.log2(maxPow2), 8);
  head.writeUInt16BE(numTables * 16 - maxPow2 * 16, 10);
  const bodies: Buffer[] = [];
  let offset = head.length;
  tables.forEach((t, i) => {
    const r = 12 + i * 16;
    head.writeUInt32BE(t.tag, r);
    head.writeUInt32BE(t.checksum, r + 4);
    head.writeUInt32BE(offset, r + 8);
    head.writeUInt32BE(t.data.length, r + 12);
    const padded = Buffer.alloc((t.data.length + 3) & ~3);
    t.data.copy(padded);
    bodies.push(padded);
    offset += padded.length;
  });
  return Buffer.concat([head, ...bodies]);
}
