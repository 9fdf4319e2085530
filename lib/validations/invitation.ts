import { z } from "zod";

/** A new account from an invitation. Password strength is checked by passwordProblems (lib/auth/password.ts). */
export const acceptNewAccountSchema = z
  .object({
    token: z.string().min(20).max(200),
    name: z.string().trim().min(2, "Enter your name as colleagues know it (at least 2 characters).").max(120, "Use at most 120 characters for the name."),
    password: z.string().min(1, "Choose a password."),
    confirm: z.string().min(1, "Type the password again."),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ; type the same password twice." });

/** Accepting with an account that already exists: its password proves the invitee owns it. */
export const acceptExistingAccountSchema = z.object({
  token: z.string().min(20).max(200),
  password: z.string().min(1, "Enter the password of your existing Synledger account.").max(200),
});
