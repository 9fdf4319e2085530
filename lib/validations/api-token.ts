import { z } from "zod";

/** Creating a site's API token (settings → API tokens). */
export const createApiTokenSchema = z.object({
  siteId: z.uuid("Choose the site the token may write readings for."),
  label: z
    .string()
    .trim()
    .min(1, "Give the token a label, e.g. the plant system that will use it.")
    .max(80, "Labels are at most 80 characters."),
});

export const revokeApiTokenSchema = z.object({
  tokenId: z.uuid("That token could not be identified; reload the page."),
});
