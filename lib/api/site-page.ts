import { z } from "zod";
import { blankIsAbsent } from "@/lib/validations/blank";
import { HttpError, zodIssues } from "@/lib/auth/errors";

/** Sites per answer of GET /api/v1/sites unless `limit` says otherwise, and the most it may say. */
export const SITE_PAGE_DEFAULT = 100;
export const SITE_PAGE_MAX = 500;

/** Where the next page starts: after this name and id (the list's order), as base64url JSON. */
const cursorSchema = z.tuple([z.string().max(200), z.uuid()]);

export function encodeSiteCursor(last: { name: string; id: string }): string {
  return Buffer.from(JSON.stringify([last.name, last.id]), "utf8").toString("base64url");
}

const pageSchema = z.object({
  limit: z.preprocess(
    blankIsAbsent,
    z.coerce
      .number({ error: "limit must be a whole number" })
      .int("limit must be a whole number")
      .min(1, "limit must be at least 1")
      .max(SITE_PAGE_MAX, `limit must be at most ${SITE_PAGE_MAX}`)
      .default(SITE_PAGE_DEFAULT),
  ),
  after: z.preprocess(
    blankIsAbsent,
    z
      .string()
      .max(400, "after is not a cursor this API gave")
      .transform((text, ctx) => {
        try {
          const parsed = cursorSchema.safeParse(JSON.parse(Buffer.from(text, "base64url").toString("utf8")));
          if (parsed.success) return { name: parsed.data[0], id: parsed.data[1] };
        } catch {
          /* falls through to the issue below */
        }
        ctx.addIssue({ code: "custom", message: "after is not a cursor this API gave; pass the `next` of the previous page" });
        return z.NEVER;
      })
      .optional(),
  ),
});

export type SitePage = z.output<typeof pageSchema>;

/** `limit` and `after` from the query string; a 400 naming the parameter otherwise. */
export function sitePageOf(params: URLSearchParams): SitePage {
  const r = pageSchema.safeParse({ limit: params.get("limit") ?? undefined, after: params.get("after") ?? undefined });
  if (!r.success) throw new HttpError(400, "invalid_query", "The query string is not valid.", zodIssues(r.error.issues));
  return r.data;
}
