import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import { z } from "zod";
import { authConfig } from "./auth.config";
import { getDb } from "./db";
import { findUserByEmail, membershipsOf, recordSignInAttempt, signInBlocked } from "./db/queries/users";
import { verifyPassword } from "./lib/auth/password";
import { isRole } from "./lib/auth/roles";

/** Codes the sign-in form turns into messages (lib/auth/sign-in-messages.ts). */
class SignInRefused extends CredentialsSignin {
  constructor(code: "bad-credentials" | "rate-limited" | "no-role" | "disabled") {
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
        const { email, password } = parsed.data;
        const db = getDb();
        const ip = clientIp(request);
        if (await signInBlocked(db, email, ip)) throw new SignInRefused("rate-limited");
        const user = await findUserByEmail(db, email);
        const ok = await verifyPassword(password, user?.passwordHash);
        await recordSignInAttempt(db, email, ip, Boolean(user && ok));
        if (!user || !ok) throw new SignInRefused("bad-credentials");
        if (user.disabled) throw new SignInRefused("disabled");
        const [first] = (await membershipsOf(db, user.id)).filter((m) => m.roles.some(isRole));
        if (!first) throw new SignInRefused("no-role");
        return {
          id: user.id,
          name: user.name,
          email: user.email,
          organisationId: first.organisationId,
          organisationName: first.organisationName,
          roles: first.roles,
        };
      },
    }),
  ],
});
