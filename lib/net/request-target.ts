/**
 * A request path whose %-escapes do not decode to whole Unicode (an escaped lone surrogate such
 * as %ED%A0%80, or a stray "%") makes Next.js's router throw and answer 500. server.ts checks the
 * path first and answers 400 in the API's error body instead.
 */
export function wellFormedPath(url: string): boolean {
  const q = url.indexOf("?");
  const path = q === -1 ? url : url.slice(0, q);
  try {
    return path.split("/").every((segment) => decodeURIComponent(segment).isWellFormed());
  } catch {
    return false;
  }
}

export const MALFORMED_PATH_BODY = JSON.stringify({
  error: { code: "invalid_input", message: "The address is not well-formed: a %-escape in its path is not valid UTF-8.", issues: [{ path: "url", message: "not valid UTF-8 after %-decoding" }] },
});
