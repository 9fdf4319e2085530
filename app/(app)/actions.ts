"use server";

import { signOut } from "@/auth";

/** Ends the session; signOut answers with a redirect to the sign-in page. */
export async function signOutAction(): Promise<void> {
  await signOut({ redirectTo: "/sign-in?notice=signed-out" });
}
