/**
 * Numbers in import files, read as text and normalised to a plain decimal string ("1234.5").
 * They never pass through a JavaScript float. A separator the mapping does not declare is
 * refused rather than guessed: "1,234" is a thousand-odd in one plant and one-point-two in the next.
 */
export const DECIMAL_SEPARATORS = [".", ","] as const;
export type DecimalSeparator = (typeof DECIMAL_SEPARATORS)[number];
export const THOUSANDS_SEPARATORS = ["none", ",", ".", " ", "'"] as const;
export type ThousandsSeparator = (typeof THOUSANDS_SEPARATORS)[number];

export interface NumberFormat {
  decimal: DecimalSeparator;
  thousands: ThousandsSeparator;
}

export type NumberResult = { ok: true; value: string } | { ok: false; reason: string };

const SEP_NAMES: Record<string, string> = { ",": "comma", ".": "dot", " ": "space", "'": "apostrophe" };

function escape(s: string): string {
  return s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
}

/**
 * The patterns for every declared format, built once from the fixed separator lists above: a
 * mapping only chooses among them, so nothing from a file or a request becomes a pattern.
 */
const PATTERNS = new Map(
  DECIMAL_SEPARATORS.flatMap((d) =>
    THOUSANDS_SEPARATORS.map((t) => {
      const dec = escape(d);
      // eslint-disable-next-line no-restricted-syntax -- built from the constant lists above, never from input
      const plain = new RegExp(`^\\d+(?:${dec}\\d+)?$`);
      // eslint-disable-next-line no-restricted-syntax -- built from the constant lists above, never from input
      const grouped = t === "none" ? null : new RegExp(`^\\d{1,3}(?:${escape(t)}\\d{3})+(?:${dec}\\d+)?$`);
      return [`${d}|${t}`, { plain, grouped }] as const;
    }),
  ),
);

/** `what` names the value in messages ("quantity", "mol %"). */
export function parseNumber(text: string, fmt: NumberFormat, what = "value"): NumberResult {
  // Non-breaking and narrow spaces are what spreadsheets write as a space separator.
  const t = text.replace(/[\u00a0\u202f]/g, " ").trim();
  if (!t) return { ok: false, reason: `the ${what} is empty` };
  const body = t.startsWith("+") ? t.slice(1) : t;
  if (/^-\s*\d/.test(body) || /^\(\d[\d.,' ]*\)$/.test(body)) {
    return { ok: false, reason: `"${t}" is negative; a ${what} cannot be below zero` };
  }
  const patterns = PATTERNS.get(`${fmt.decimal}|${fmt.thousands}`);
  if (!patterns) return { ok: false, reason: "the number format of the mapping is not one Synledger knows" };
  const { plain, grouped } = patterns;
  if (plain.test(body) || grouped?.test(body)) {
    const noGroups = fmt.thousands === "none" ? body : body.split(fmt.thousands).join("");
    const normal = fmt.decimal === "," ? noGroups.replace(",", ".") : noGroups;
    return { ok: true, value: normal };
  }
  if (/^\d[\d.,' ]*$/.test(body)) {
    const other = [",", ".", " ", "'"].find((s) => s !== fmt.decimal && body.includes(s) && s !== fmt.thousands);
    if (other) {
      return {
        ok: false,
        reason: `"${t}" contains a ${SEP_NAMES[other]} (${JSON.stringify(other)}), which the mapping does not declare; set it as the thousands separator in the column mapping, or remove it`,
      };
    }
    return { ok: false, reason: `"${t}" is not a number in the declared format (decimal ${SEP_NAMES[fmt.decimal]}${fmt.thousands === "none" ? ", no thousands separator" : `, thousands ${SEP_NAMES[fmt.thousands]}`})` };
  }
  if (/^\d+(?:\.\d+)?e[+-]?\d+$/i.test(body)) return { ok: false, reason: `"${t}" is in exponent notation; write the number out in full` };
  return { ok: false, reason: `"${t}" is not a number` };
}
