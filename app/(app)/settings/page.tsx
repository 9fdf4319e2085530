import { redirect } from "next/navigation";
import { requirePageActor } from "@/lib/auth/guard";

/** Settings opens on its first section; the permission check happens before the redirect. */
export default async function SettingsPage() {
  await requirePageActor("org:manage-users");
  redirect("/settings/users");
}
