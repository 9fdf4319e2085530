import { z } from "zod";

/** Changing one's own password (account page). Strength is checked by passwordProblems (lib/auth/password.ts). */
export const changePasswordSchema = z
  .object({
    current: z.string().min(1, "Enter your current password.").max(200),
    password: z.string().min(1, "Choose a new password.").max(200),
    confirm: z.string().min(1, "Type the new password again."),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two new passwords differ; type the same password twice." })
  .refine((v) => v.password !== v.current, { path: ["password"], message: "The new password is the same as the current one." });

/** Ending one of one's own sessions. */
export const endSessionSchema = z.object({
  sessionId: z.uuid("That session could not be identified; reload the page."),
});
