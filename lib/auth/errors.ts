/** Errors that server code throws and that handlers turn into a JSON body or a form message. */
export interface IssueDetail {
  /** Where the problem is: a field name or a JSON path such as `streams[2].quantity`. */
  path: string;
  message: string;
}

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues: IssueDetail[] = [],
  ) {
    super(message);
  }
}

export const unauthorized = () => new HttpError(401, "unauthorized", "Sign in first.");
export const forbidden = (what: string) => new HttpError(403, "forbidden", `Your role does not allow you to ${what}.`);
/** Used for other organisations' records too, so their existence is not revealed. */
export const notFound = (what: string) => new HttpError(404, "not_found", `${what} was not found.`);

/** Turns zod issues into path + message pairs (`streams[2].quantity`). */
export function zodIssues(issues: readonly { path: readonly PropertyKey[]; message: string }[]): IssueDetail[] {
  return issues.map((i) => ({
    path: i.path.reduce<string>((acc, seg) => (typeof seg === "number" ? `${acc}[${seg}]` : acc ? `${acc}.${String(seg)}` : String(seg)), ""),
    message: i.message,
  }));
}

/**
 * A caller's value quoted inside a message: JSON-escaped (so control characters and lone
 * surrogates cannot reach a log or a body raw) and cut to 40 characters, so a 1 000-character
 * path segment does not come back whole.
 */
export function quoted(value: string, max = 40): string {
  const cut = value.length > max ? `${value.slice(0, max)}…` : value;
  return JSON.stringify(cut.toWellFormed());
}
