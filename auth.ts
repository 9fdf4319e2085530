import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import { z } from "zod";
import { authConfig } from "./auth.config";
import { getDb } from "./db";
import { authenticate, type SignInRefusal } from "./lib/auth/credentials";

/** Carries the refusal code to the sign-in form, which turns it into a message. */
class SignInRefused extends CredentialsSignin {
  constructor(code: SignInRefusal) {
    super();
    this.code = code;
  }
}

const credentialsSchema = z.object({
  email: z.string().trim().toLowerCase().email(),
  password: z.string().min(1).max(200),
});

function clientIp(request: Request): string {
  const fwd = request.headers.get("x-forwarded-for");
  return fwd?.split(",")[0]?.trim() || request.headers.get("x-real-ip") || "local";
}

export const { handlers, auth, signIn, signOut } = NextAuth({
  ...authConfig,
  providers: [
    Credentials({
      credentials: { email: {}, password: {} },
      async authorize(raw, request) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) throw new SignInRefused("bad-credentials");
        const result = await authenticate(getDb(), parsed.data.email, parsed.data.password, clientIp(request));
        if (!result.ok) throw new SignInRefused(result.reason);
        return result.user;
      },
    }),
  ],
});
