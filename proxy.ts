import NextAuth from "next-auth";
import { authConfig } from "./auth.config";

/** Sends signed-out visitors of app pages to the sign-in page; API routes answer for themselves. */
export default NextAuth(authConfig).auth;

export const config = {
  matcher: ["/((?!_next/static|_next/image|fonts/|favicon.ico|robots.txt).*)"],
};
