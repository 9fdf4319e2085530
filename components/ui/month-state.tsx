import { STATE_LABELS, type MonthState } from "@/lib/month-states";
import { Status, type StatusTone } from "./status";

export type { MonthState };

const TONES: Record<MonthState, StatusTone> = { open: "pending", balanced: "ok", in_review: "info", signed: "locked", submitted: "ok" };

/** The month life cycle in the product's words (lib/month-states.ts), each with its own icon. */
export const MONTH_STATES: Record<MonthState, { label: string; tone: StatusTone }> = Object.fromEntries(
  Object.entries(STATE_LABELS).map(([state, label]) => [state, { label, tone: TONES[state as MonthState] }]),
) as Record<MonthState, { label: string; tone: StatusTone }>;

export function MonthStateBadge({ state }: { state: MonthState | null }) {
  if (!state) return <Status tone="info">Not started</Status>;
  const s = MONTH_STATES[state];
  return <Status tone={s.tone}>{s.label}</Status>;
}
