/**
 * The month life cycle as data (BRIEF.md): Open → Balanced → In review → Signed → Submitted,
 * and Reopen back to Open with revision n+1. Pure, so the page, the service and the tests read
 * the same table and cannot disagree about who may do what.
 */
import { PERMISSIONS, ROLE_LABELS, type Role } from "@/lib/auth/roles";
import type { MonthState } from "@/lib/month-states";


export const TRANSITIONS = ["balance", "send-for-review", "return", "sign", "record-submission", "reopen"] as const;
export type TransitionName = (typeof TRANSITIONS)[number];

/** Shortest written reason we accept: long enough that "ok" or "see above" is refused. */
export const MIN_REASON_CHARS = 10;

export interface TransitionRule {
  name: TransitionName;
  /** Button text. */
  label: string;
  /** Past tense for the history and e-mails. */
  done: string;
  from: readonly MonthState[];
  to: MonthState;
  roles: readonly Role[];
  /** "always": a reason must be written; "outside-tolerance": only when a balance does not close. */
  reason: "none" | "optional" | "always" | "outside-tolerance";
  /** Who hears about it: the people who act next. */
  notify: readonly Role[];
  /** Plain-language precondition shown beside the button. */
  explains: string;
}

export const RULES: Record<TransitionName, TransitionRule> = {
  balance: {
    name: "balance",
    label: "Close the balance",
    done: "closed the balance",
    from: ["open"],
    to: "balanced",
    roles: PERMISSIONS["month:balance"],
    reason: "outside-tolerance",
    notify: ["environmental_officer"],
    explains: `The month must compute, and each balance must close within the site's tolerance, or you write why it does not (at least ${MIN_REASON_CHARS} characters).`,
  },
  "send-for-review": {
    name: "send-for-review",
    label: "Send for sign-off",
    done: "sent the statement for sign-off",
    from: ["balanced"],
    to: "in_review",
    roles: PERMISSIONS["month:prepare"],
    reason: "optional",
    notify: ["signatory"],
    explains: "The month needs its emissions method and factor set, must still compute with them, and its last day must have passed. Sending freezes its figures, stream definitions and method.",
  },
  return: {
    name: "return",
    label: "Return with comments",
    done: "returned the statement",
    from: ["in_review"],
    to: "balanced",
    roles: PERMISSIONS["month:sign"],
    reason: "always",
    notify: ["environmental_officer", "process_engineer"],
    explains: `Say what must change (at least ${MIN_REASON_CHARS} characters); the month goes back to Balanced.`,
  },
  sign: {
    name: "sign",
    label: "Sign the statement",
    done: "signed the statement",
    from: ["in_review"],
    to: "signed",
    roles: PERMISSIONS["month:sign"],
    reason: "none",
    notify: ["environmental_officer"],
    explains:
      "Renders the statement from the stored figures and seals it with the organisation's certificate. You cannot sign a revision whose balance you closed yourself.",
  },
  "record-submission": {
    name: "record-submission",
    label: "Record submission",
    done: "recorded the submission to the authority",
    from: ["signed"],
    to: "submitted",
    roles: PERMISSIONS["month:prepare"],
    reason: "none",
    notify: ["signatory"],
    explains: "Enter the authority's reference and the date the statement was submitted.",
  },
  reopen: {
    name: "reopen",
    label: "Reopen",
    done: "reopened the month",
    from: ["signed", "submitted"],
    to: "open",
    // Officer (a correction asked for by the authority) or signatory (a mistake found after
    // signing); not the engineer, so whoever edits figures cannot also unfreeze signed ones alone.
    roles: ["environmental_officer", "signatory"],
    reason: "always",
    notify: ["process_engineer"],
    explains: `Starts revision n+1 with the figures open for correction; every signed PDF stays as it is. A reason is required (at least ${MIN_REASON_CHARS} characters).`,
  },
};

export function mayPerform(roles: readonly Role[], t: TransitionName): boolean {
  return roles.some((r) => RULES[t].roles.includes(r));
}

/** Transitions that start from `state`, whoever may perform them. */
export function transitionsFrom(state: MonthState): TransitionRule[] {
  return TRANSITIONS.map((t) => RULES[t]).filter((r) => r.from.includes(state));
}

export function rolesText(t: TransitionName): string {
  return RULES[t].roles.map((r) => ROLE_LABELS[r]).join(" or ");
}

export function reasonIsLongEnough(reason: string | null | undefined): boolean {
  return (reason ?? "").trim().length >= MIN_REASON_CHARS;
}
