import NextAuth from "next-auth";
import { authConfig } from "./auth.config";

/**
 * Sends signed-out visitors of app pages to the sign-in page. API routes answer for themselves
 * and are kept out entirely: a proxy buffers request bodies (Next keeps only the first 10 MB),
 * so an upload or a file to verify would reach its route cut short; each route reads its own
 * body within its own limit.
 */
export default NextAuth(authConfig).auth;

export const config = {
  matcher: ["/((?!api/|_next/static|_next/image|fonts/|favicon.ico|robots.txt).*)"],
};
