import { z } from "zod";

/** What the sign-in form sends; the same limits as the Credentials provider in auth.ts. */
export const signInSchema = z.object({
  email: z.string().trim().toLowerCase().min(1, "Enter your e-mail address.").pipe(z.email("Enter an e-mail address such as name@plant.example.")),
  password: z.string().min(1, "Enter your password.").max(200, "Passwords are at most 200 characters."),
});
export type SignInInput = z.infer<typeof signInSchema>;

/** Codes thrown by auth.ts (`SignInRefused`). */
export type SignInCode = "bad-credentials" | "rate-limited" | "no-role" | "disabled";

/**
 * Messages per code. A wrong password and an unknown address share one message on purpose, so
 * the form never tells a stranger which addresses have accounts.
 */
export const SIGN_IN_MESSAGES: Record<SignInCode | "unknown", string> = {
  "bad-credentials": "That e-mail address and password do not match an account. Check both and try again.",
  "rate-limited": "Too many unsuccessful attempts. Wait about 15 minutes before trying again.",
  "no-role": "Your account has no role in any organisation yet. Ask an administrator of your organisation to give you one.",
  disabled: "This account has been disabled. Ask an administrator of your organisation if you need access again.",
  unknown: "Signing in did not work because of a problem on our side. Try again in a minute.",
};

export function signInMessage(code: string | undefined): string {
  return code && code in SIGN_IN_MESSAGES ? SIGN_IN_MESSAGES[code as SignInCode] : SIGN_IN_MESSAGES.unknown;
}

/** Only same-site paths may be used after signing in, so the form cannot be an open redirect. */
export function safeCallbackPath(value: unknown): string {
  if (typeof value !== "string" || !value.startsWith("/") || value.startsWith("//") || value.startsWith("/\\")) return "/";
  if (value.startsWith("/sign-in") || value.startsWith("/api/")) return "/";
  return value;
}
