import type { ReactNode } from "react";
import { Providers } from "@/components/providers";
import { AppHeader } from "@/components/shell/app-header";
import { HydrationMark } from "@/components/shell/hydration-mark";
import { CautionLine } from "@/components/ui/caution-line";
import { previousMonthKey } from "@/lib/period";
import { getDb } from "@/db";
import { listSites } from "@/db/queries/sites";
import { requirePageActor } from "@/lib/auth/guard";

/** Shell of every signed-in page. Each page checks its own permission again; this only needs a member. */
export default async function AppLayout({ children }: { children: ReactNode }) {
  const actor = await requirePageActor();
  const sites = await listSites(getDb(), actor.organisationId);
  return (
    <div className="flex min-h-dvh flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-3 focus:top-3 focus:z-10 focus:bg-white focus:px-3 focus:py-2">
        Skip to content
      </a>
      <AppHeader actor={actor} sites={sites} defaultMonth={previousMonthKey()} />
      <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-5 py-6">
        <Providers>{children}</Providers>
      </main>
      <HydrationMark />
      <footer className="border-t border-rule px-5 py-4">
        <CautionLine className="mx-auto max-w-6xl" />
      </footer>
    </div>
  );
}
