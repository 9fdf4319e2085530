import Link from "next/link";
import { EmptyState } from "@/components/ui/empty-state";
import { buttonPrimary } from "@/components/ui/styles";

export function SitesEmptyState({ organisationName }: { organisationName: string }) {
  return (
    <EmptyState
      title="No sites set up yet"
      action={
        <Link href="/settings/sites/new" className={buttonPrimary}>
          Set up a site
        </Link>
      }
    >
      <p>
        Each site of {organisationName} is listed here with its metering reference, balance tolerance, emissions method and factor
        set. Once a site has its streams, process engineers can enter its monthly figures.
      </p>
    </EmptyState>
  );
}
