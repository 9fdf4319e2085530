import type { DefaultSession } from "next-auth";
import type { Role } from "@/lib/auth/roles";

declare module "next-auth" {
  interface User {
    /** The user_sessions row this sign-in opened. */
    sessionId: string;
    organisationId: string;
    organisationName: string;
    roles: Role[];
  }
  interface Session {
    user: {
      id: string;
      sessionId: string;
      organisationId: string;
      organisationName: string;
      roles: Role[];
    } & DefaultSession["user"];
  }
}

declare module "@auth/core/jwt" {
  interface JWT {
    userId: string;
    sessionId: string;
    organisationId: string;
    organisationName: string;
    roles: Role[];
  }
}
