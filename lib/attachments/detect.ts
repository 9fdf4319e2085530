/**
 * What a file really is, read from its first bytes rather than its name or the browser's claim.
 * Only four types are accepted; the others are recognised only to say what was sent instead.
 */
export const ACCEPTED = {
  "application/pdf": { label: "PDF document", extensions: ["pdf"] },
  "image/png": { label: "PNG image", extensions: ["png"] },
  "image/jpeg": { label: "JPEG image", extensions: ["jpg", "jpeg"] },
  "text/csv": { label: "CSV text file", extensions: ["csv"] },
} as const;
export type AcceptedType = keyof typeof ACCEPTED;

const starts = (b: Uint8Array, sig: number[], at = 0) => sig.every((v, i) => b[at + i] === v);

/** Other formats worth naming in a refusal (signatures from the formats' own specifications, from memory). */
const OTHERS: { label: string; test: (b: Uint8Array) => boolean }[] = [
  { label: "a ZIP archive (an Office document such as .xlsx or .docx is one)", test: (b) => starts(b, [0x50, 0x4b, 0x03, 0x04]) },
  { label: "a legacy Office document (.xls or .doc)", test: (b) => starts(b, [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]) },
  { label: "a GIF image", test: (b) => starts(b, [0x47, 0x49, 0x46, 0x38]) },
  { label: "a TIFF image", test: (b) => starts(b, [0x49, 0x49, 0x2a, 0x00]) || starts(b, [0x4d, 0x4d, 0x00, 0x2a]) },
  { label: "a WebP image", test: (b) => starts(b, [0x52, 0x49, 0x46, 0x46]) && starts(b, [0x57, 0x45, 0x42, 0x50], 8) },
  { label: "a program or library", test: (b) => starts(b, [0x7f, 0x45, 0x4c, 0x46]) || starts(b, [0x4d, 0x5a]) },
  { label: "UTF-16 text", test: (b) => starts(b, [0xff, 0xfe]) || starts(b, [0xfe, 0xff]) },
];

export type Detected = { type: AcceptedType; label: string } | { type: null; label: string };

function isUtf8Text(bytes: Uint8Array): boolean {
  if (bytes.includes(0)) return false;
  try {
    new TextDecoder("utf-8", { fatal: true }).decode(bytes);
    return true;
  } catch {
    return false;
  }
}

export function detectType(bytes: Uint8Array): Detected {
  if (starts(bytes, [0x25, 0x50, 0x44, 0x46, 0x2d])) return { type: "application/pdf", label: ACCEPTED["application/pdf"].label }; // "%PDF-"
  if (starts(bytes, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return { type: "image/png", label: ACCEPTED["image/png"].label };
  if (starts(bytes, [0xff, 0xd8, 0xff])) return { type: "image/jpeg", label: ACCEPTED["image/jpeg"].label };
  const other = OTHERS.find((o) => o.test(bytes));
  if (other) return { type: null, label: other.label };
  if (isUtf8Text(bytes)) return { type: "text/csv", label: ACCEPTED["text/csv"].label };
  return { type: null, label: "binary data of a type Synledger does not accept" };
}

export function extensionOf(name: string): string {
  const dot = name.lastIndexOf(".");
  return dot > 0 ? name.slice(dot + 1).toLowerCase() : "";
}

/** Browsers label CSV files in several ways (Windows often says Excel); these all mean "a CSV". */
const CSV_CLAIMS = ["text/csv", "text/plain", "application/csv", "application/vnd.ms-excel", "text/comma-separated-values"];

export type Verdict = { ok: true; type: AcceptedType } | { ok: false; reason: string };

/** Accepts a file only when its content, its name's extension and the claimed type agree. */
export function checkAttachment(name: string, claimedType: string, bytes: Uint8Array): Verdict {
  const found = detectType(bytes);
  const accepted = Object.values(ACCEPTED).map((a) => a.label).join(", ");
  if (!found.type) return { ok: false, reason: `"${name}" is ${found.label}; only ${accepted} can be attached.` };
  const ext = extensionOf(name);
  const expected: readonly string[] = ACCEPTED[found.type].extensions;
  if (!expected.includes(ext)) {
    const namedAs = Object.values(ACCEPTED).find((a) => (a.extensions as readonly string[]).includes(ext));
    return {
      ok: false,
      reason: `"${name}" is really a ${found.label}${namedAs ? `, not a ${namedAs.label}` : ""}; rename it to .${expected[0]} if that is what you meant to attach.`,
    };
  }
  const claim = claimedType.split(";")[0].trim().toLowerCase();
  const claimOk = !claim || claim === "application/octet-stream" || claim === found.type || (found.type === "text/csv" && CSV_CLAIMS.includes(claim));
  if (!claimOk) return { ok: false, reason: `"${name}" was sent as ${claim} but its content is a ${found.label}.` };
  return { ok: true, type: found.type };
}
