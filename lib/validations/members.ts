import { z } from "zod";
import { ROLES } from "@/lib/auth/roles";

const roleList = z
  .array(z.enum(ROLES, { error: "That role does not exist." }))
  .min(1, "Choose at least one role.")
  .transform((roles) => [...new Set(roles)]);

/** Changing a member's roles (settings → users). */
export const memberRolesSchema = z.object({
  userId: z.uuid("That member could not be identified; reload the page."),
  roles: roleList,
});

/** Inviting someone by e-mail with the roles they will hold. */
export const inviteSchema = z.object({
  email: z
    .string()
    .trim()
    .toLowerCase()
    .min(1, "Enter the e-mail address to invite.")
    .max(254, "E-mail addresses are at most 254 characters.")
    .pipe(z.email("Enter an e-mail address such as name@plant.example.")),
  roles: roleList,
});

/** Disabling or enabling a member's account (settings → users). */
export const memberAccessSchema = z.object({
  userId: z.uuid("That member could not be identified; reload the page."),
  access: z.enum(["disable", "enable"], { error: "Choose disable or enable." }),
});

/** Removing a member from the organisation (settings → users). */
export const removeMemberSchema = z.object({
  userId: z.uuid("That member could not be identified; reload the page."),
});

export const revokeSchema = z.object({
  invitationId: z.uuid("That invitation could not be identified; reload the page."),
});

/** Reads a form's fields into the plain object the schemas expect (checkbox groups as arrays). */
export function formFields(formData: FormData, arrays: string[] = []): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const key of new Set(formData.keys())) {
    if (key.startsWith("$ACTION")) continue;
    out[key] = arrays.includes(key) ? formData.getAll(key).map(String) : String(formData.get(key) ?? "");
  }
  for (const key of arrays) out[key] ??= [];
  return out;
}
