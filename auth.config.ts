import type { NextAuthConfig } from "next-auth";

/**
 * Edge-safe part of the Auth.js configuration, shared by the proxy and by auth.ts.
 * Sessions are JWTs that carry the user, the session row, the active organisation and its roles;
 * server code re-reads the membership and the session row on every request (lib/auth/guard.ts),
 * so an ended session stops working at once, whatever the cookie's expiry says.
 */
export const authConfig = {
  pages: { signIn: "/sign-in" },
  session: { strategy: "jwt", maxAge: 8 * 60 * 60 },
  providers: [],
  callbacks: {
    authorized({ auth, request }) {
      const path = request.nextUrl.pathname;
      // Statement verification is public: whoever holds a copy checks it without an account.
      const open = path === "/sign-in" || path === "/verify" || path.startsWith("/verify/") || path.startsWith("/invitations/") || path.startsWith("/api/");
      if (open) return true;
      return !!auth?.user;
    },
    jwt({ token, user }) {
      if (user) {
        token.userId = user.id as string;
        token.sessionId = user.sessionId;
        token.organisationId = user.organisationId;
        token.organisationName = user.organisationName;
        token.roles = user.roles;
      }
      return token;
    },
    session({ session, token }) {
      session.user.id = token.userId;
      session.user.sessionId = token.sessionId;
      session.user.organisationId = token.organisationId;
      session.user.organisationName = token.organisationName;
      session.user.roles = token.roles;
      return session;
    },
  },
} satisfies NextAuthConfig;
