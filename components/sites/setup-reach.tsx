import { monthLabel } from "@/reports/format";
import { Notice } from "@/components/ui/status";

const list = (periods: string[]) => (periods.length > 4 ? `${monthLabel(periods[0])} to ${monthLabel(periods[periods.length - 1])}` : periods.map(monthLabel).join(", "));

/** Which months a change of the site's set-up will reach, said before anyone saves. */
export function SetupReach({ reached, frozen, what }: { reached: string[]; frozen: string[]; what: string }) {
  return (
    <Notice tone="info" title="Which months a change here reaches">
      {reached.length
        ? `A change to ${what} applies to the ${reached.length} ${reached.length === 1 ? "month" : "months"} not yet sent for review (${list(reached)}) and to months started later.`
        : `No month of this site is open for change; a change to ${what} applies to months started from now on.`}{" "}
      {frozen.length
        ? `The ${frozen.length} ${frozen.length === 1 ? "month" : "months"} in review, signed or submitted (${list(frozen)}) keep the set-up they were frozen with.`
        : ""}
    </Notice>
  );
}
