import Link from "next/link";
import type { ReactNode } from "react";
import { CautionLine } from "@/components/ui/caution-line";
import { BeamMark } from "@/components/ui/icons";
import { link } from "@/components/ui/styles";

/** Pages anyone may open without an account: statement verification. No organisation data but what a statement makes public. */
export default function PublicLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col">
      <header className="border-b border-rule bg-white">
        <div className="mx-auto flex max-w-4xl flex-wrap items-center justify-between gap-2 px-5 py-3">
          <Link href="/verify" className="flex items-center gap-2 text-accent-strong">
            <BeamMark className="size-6" />
            <span className="text-lg font-semibold tracking-tight text-ink">Synledger</span>
            <span className="text-sm text-ink-soft">· statement verification</span>
          </Link>
          <Link href="/sign-in" className={`${link} text-sm`}>
            Sign in
          </Link>
        </div>
      </header>
      <main className="mx-auto w-full max-w-4xl flex-1 px-5 py-8">{children}</main>
      <footer className="mx-auto w-full max-w-4xl px-5 pb-6">
        <CautionLine />
      </footer>
    </div>
  );
}
