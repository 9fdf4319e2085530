import type { Metadata } from "next";
import { EmptyState } from "@/components/ui/empty-state";
import { pageTitle } from "@/components/ui/styles";
import { requirePageActor } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Statements" };

export default async function StatementsPage() {
  await requirePageActor();
  return (
    <div className="space-y-6">
      <h1 className={pageTitle}>Statements</h1>
      <EmptyState title="No statements yet">
        <p>
          Monthly and annual emissions statements will be listed here with their state, revision and who signed them. Each signed
          statement is a digitally signed PDF kept unchanged; you will be able to download it and check its signature.
        </p>
        <p>An environmental officer prepares a statement once a month&rsquo;s balances are closed, and a signatory signs it.</p>
      </EmptyState>
    </div>
  );
}
