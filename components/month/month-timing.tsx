import { monthLabel } from "@/reports/format";
import { Notice } from "@/components/ui/status";
import { dayLabel as day, type MonthTiming } from "@/lib/period";

/** What a month that has not ended is: in progress (figures coming in), or not begun (nothing to enter yet). */
export function MonthTimingNotice({ period, timing, coveredThrough }: { period: string; timing: MonthTiming; coveredThrough: string | null }) {
  if (timing.kind === "future") {
    return (
      <Notice tone="info" title={`${monthLabel(period)} has not begun`}>
        Its figures can be entered from {day(timing.opensOn)}. Until then there is nothing to enter, balance or sign.
      </Notice>
    );
  }
  if (timing.kind !== "in-progress") return null;
  return (
    <Notice tone="pending" title={`In progress: day ${timing.day} of ${timing.days}`}>
      Figures can be entered as the days pass{coveredThrough ? `; the figures saved cover the days up to ${day(coveredThrough)}` : "; the figures saved do not say which days they cover"}. The month is
      provisional: it is left out of year-to-date totals, and it can be balanced and sent for sign-off from {day(timing.closesOn)}, once its last day ({day(timing.lastDay)})
      has passed.
    </Notice>
  );
}
