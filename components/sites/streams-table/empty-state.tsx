import Link from "next/link";
import { EmptyState } from "@/components/ui/empty-state";
import { buttonPrimary } from "@/components/ui/styles";

export function StreamsEmptyState({ siteId, siteName }: { siteId: string; siteName: string }) {
  return (
    <EmptyState
      title="No streams yet"
      action={
        <Link href={`/settings/sites/${siteId}/streams/new`} className={buttonPrimary}>
          Add a stream
        </Link>
      }
    >
      <p>
        Streams are the metered flows that cross the boundary of {siteName}: feed and fuel gas, process air, ammonia, CO2 exported
        or vented, purge, electricity and steam. Each gets one row in the monthly entry form.
      </p>
    </EmptyState>
  );
}
