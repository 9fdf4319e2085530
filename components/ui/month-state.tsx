import { Status, type StatusTone } from "./status";

export type MonthState = "open" | "balanced" | "in_review" | "signed" | "submitted";

/** The month life cycle in the product's words (BRIEF.md), each with its own icon. */
export const MONTH_STATES: Record<MonthState, { label: string; tone: StatusTone }> = {
  open: { label: "Open", tone: "pending" },
  balanced: { label: "Balanced", tone: "ok" },
  in_review: { label: "In review", tone: "info" },
  signed: { label: "Signed", tone: "locked" },
  submitted: { label: "Submitted", tone: "ok" },
};

export function MonthStateBadge({ state }: { state: MonthState | null }) {
  if (!state) return <Status tone="info">Not started</Status>;
  const s = MONTH_STATES[state];
  return <Status tone={s.tone}>{s.label}</Status>;
}
