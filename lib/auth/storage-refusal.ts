import { HttpError } from "./errors";

/**
 * PostgreSQL refusing a value is the sender's mistake, not ours: text holding U+0000 (text and
 * jsonb cannot store it) or a number beyond what `numeric` keeps. Validation catches most of
 * these with a path; this is the net under every route and action for the ones it misses, so the
 * answer is a 400 saying what to change instead of a 500. The transaction has rolled back.
 */
const CODES: Record<string, string> = {
  "22021": "Text may not contain the NUL character (U+0000); remove it and send again.",
  "22P05": "Text may not contain the NUL character (U+0000); remove it and send again.",
  "22003": "A number is too large, or has too many decimals, to be stored; check the figures and send again.",
};

function pgCode(err: unknown): string | null {
  for (let e = err, depth = 0; e && typeof e === "object" && depth < 4; e = (e as { cause?: unknown }).cause, depth++) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === "string" && code in CODES) return code;
  }
  return null;
}

/** The 400 to answer instead of the database error, or null when it is something else. */
export function storageRefusal(err: unknown): HttpError | null {
  const code = pgCode(err);
  return code ? new HttpError(400, "invalid_input", CODES[code], [{ path: "body", message: CODES[code] }]) : null;
}
