import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { CautionLine } from "@/components/ui/caution-line";
import { BeamMark } from "@/components/ui/icons";
import { currentActor } from "@/lib/auth/guard";
import { safeCallbackPath } from "@/lib/validations/sign-in";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

const NOTICES: Record<string, string> = {
  joined: "Your account is ready. Sign in with the e-mail address the invitation was sent to.",
  added: "The invitation was accepted: your account now has the new organisation's roles. Sign in to continue.",
  "signed-out": "You are signed out.",
  "password-changed": "Your password was changed and every session of your account has ended. Sign in with the new password.",
  "signed-out-everywhere": "Every session of your account has ended, this one included.",
};

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const callbackUrl = safeCallbackPath(typeof params.callbackUrl === "string" ? toPath(params.callbackUrl) : "/");
  // Someone already signed in has nothing to do here.
  if (await currentActor()) redirect(callbackUrl);
  const notice = typeof params.notice === "string" ? NOTICES[params.notice] : undefined;

  return (
    <div className="flex min-h-dvh flex-col">
      <main className="mx-auto flex w-full max-w-md flex-1 flex-col justify-center px-5 py-12">
        <div className="flex items-center gap-2 text-accent-strong">
          <BeamMark className="size-7" />
          <span className="text-2xl font-semibold tracking-tight text-ink">Synledger</span>
        </div>
        <p className="mt-2 text-ink-soft">
          The shared ledger for your plant&rsquo;s monthly carbon, hydrogen and nitrogen balances and signed emissions statements.
        </p>
        <div className="mt-8 border border-rule bg-white px-6 py-6 shadow-[0_1px_0_var(--color-rule)]">
          <h1 className="mb-5 text-lg font-semibold">Sign in</h1>
          <SignInForm callbackUrl={callbackUrl} notice={notice} />
        </div>
        <p className="mt-4 text-sm text-ink-soft">
          No account? Accounts are created by invitation: ask an administrator of your organisation to invite you.
        </p>
      </main>
      <footer className="border-t border-rule px-5 py-4">
        <CautionLine className="mx-auto max-w-md" />
      </footer>
    </div>
  );
}

/** The proxy sends an absolute URL as callbackUrl; keep only its path and query. */
function toPath(value: string): string {
  if (value.startsWith("/")) return value;
  try {
    const url = new URL(value);
    return `${url.pathname}${url.search}`;
  } catch {
    return "/";
  }
}
