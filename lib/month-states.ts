/**
 * The month life cycle's vocabulary, in one place (BRIEF.md): Open → Balanced → In review →
 * Signed → Submitted. The database enum (db/schema/enums.ts), the life-cycle rules
 * (lib/lifecycle/transitions.ts), the pages and the statements all read it from here. Pure data,
 * safe in the browser.
 */
export const MONTH_STATES = ["open", "balanced", "in_review", "signed", "submitted"] as const;
export type MonthState = (typeof MONTH_STATES)[number];

/** The states' names in the product's words. */
export const STATE_LABELS: Record<MonthState, string> = {
  open: "Open",
  balanced: "Balanced",
  in_review: "In review",
  signed: "Signed",
  submitted: "Submitted",
};

/** States whose figures are frozen in a snapshot: nobody edits them until a reopen. */
export const FROZEN_MONTH_STATES = ["in_review", "signed", "submitted"] as const satisfies readonly MonthState[];
