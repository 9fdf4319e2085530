import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import { z } from "zod";
import { authConfig } from "./auth.config";
import { getDb } from "./db";
import { endSession } from "./db/queries/sessions";
import { authenticate, type SignInRefusal } from "./lib/auth/credentials";
import { clientAddressOf } from "./lib/net/forwarded";

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

export const { handlers, auth, signIn, signOut } = NextAuth({
  ...authConfig,
  providers: [
    Credentials({
      credentials: { email: {}, password: {} },
      async authorize(raw, request) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) throw new SignInRefused("bad-credentials");
        const result = await authenticate(getDb(), parsed.data.email, parsed.data.password, {
          address: clientAddressOf(request.headers),
          userAgent: request.headers.get("user-agent") ?? "",
        });
        if (!result.ok) throw new SignInRefused(result.reason);
        return result.user;
      },
    }),
  ],
  events: {
    // Signing out ends the session row too, so a copy of the cookie is worthless from now on.
    async signOut(message) {
      const token = "token" in message ? message.token : null;
      if (token?.userId && token.sessionId) await endSession(getDb(), token.userId, token.sessionId, "signed-out");
    },
  },
});
