"use server";

import { AuthError, CredentialsSignin } from "next-auth";
import { signIn } from "@/auth";
import { safeCallbackPath, signInMessage, signInSchema } from "@/lib/validations/sign-in";

export interface SignInState {
  message?: string;
  errors?: { email?: string; password?: string };
  email?: string;
}

/**
 * Signs in with e-mail and password. Success arrives as the redirect that signIn throws, so
 * only AuthError is caught here and everything else (the redirect included) is rethrown.
 */
export async function signInAction(_prev: SignInState, formData: FormData): Promise<SignInState> {
  const raw = { email: String(formData.get("email") ?? ""), password: String(formData.get("password") ?? "") };
  const parsed = signInSchema.safeParse(raw);
  if (!parsed.success) {
    const errors: SignInState["errors"] = {};
    for (const issue of parsed.error.issues) {
      const key = issue.path[0] as "email" | "password";
      errors[key] ??= issue.message;
    }
    return { message: "Check the highlighted fields.", errors, email: raw.email };
  }
  // Every role starts on the overview for now; role-specific landing pages come with their areas.
  const redirectTo = safeCallbackPath(formData.get("callbackUrl"));
  try {
    await signIn("credentials", { email: parsed.data.email, password: parsed.data.password, redirectTo });
  } catch (err) {
    if (err instanceof AuthError) {
      const code = err instanceof CredentialsSignin ? err.code : undefined;
      return { message: signInMessage(code), email: raw.email };
    }
    throw err;
  }
  return {};
}
