import { MonthStateBadge } from "@/components/ui/month-state";
import type { ActionResult } from "@/lib/auth/guard";
import type { Role } from "@/lib/auth/roles";
import { MIN_REASON_CHARS, mayPerform, rolesText, transitionsFrom, type TransitionRule } from "@/lib/lifecycle/transitions";
import { STATE_LABELS, type MonthState } from "@/lib/month-states";
import { SignForm, type SignFormProps } from "./sign-form";
import { TransitionForm } from "./transition-form";

/** What the page found out about the preconditions, so each action can say why it would fail. */
export interface Preconditions {
  computes: boolean;
  computeProblems: string[];
  outside: string[];
  method: string | null;
  factorSet: string | null;
  /** Set while the month has not ended: why it cannot be balanced or sent yet. */
  notEnded: string | null;
  certificate: string | null;
  balancedByActor: boolean;
}

export interface LifecyclePanelProps {
  roles: Role[];
  state: MonthState;
  revision: number;
  version: number;
  siteId: string;
  period: string;
  pre: Preconditions;
  action: (prev: ActionResult | null, formData: FormData) => Promise<ActionResult>;
  /** What signing shows: the preview, the declaration and the unconfirmed values to acknowledge. */
  sign?: Omit<SignFormProps, "action" | "siteId" | "period" | "version">;
}

function hints(rule: TransitionRule, pre: Preconditions): { blocked: boolean; lines: string[] } {
  const lines: string[] = [];
  let blocked = false;
  if (rule.name === "balance" || rule.name === "send-for-review") {
    if (pre.notEnded) {
      blocked = true;
      lines.push(pre.notEnded);
    }
    if (!pre.computes) {
      blocked = true;
      lines.push("The stored figures do not compute yet:", ...pre.computeProblems.slice(0, 4));
    }
  }
  if (rule.name === "balance" && pre.computes) {
    if (pre.outside.length) lines.push(...pre.outside, `Write why it does not close (at least ${MIN_REASON_CHARS} characters) to balance it anyway.`);
    else lines.push("All three balances close within the site's tolerance.");
  }
  if (rule.name === "send-for-review") {
    if (!pre.method || !pre.factorSet) {
      blocked = true;
      lines.push("An emissions method and a factor set must be chosen for the month first (Method of this month).");
    } else lines.push(`Method: ${pre.method}; factor set: ${pre.factorSet}. Sending freezes them with the figures.`);
  }
  if (rule.name === "sign") {
    if (!pre.certificate) {
      blocked = true;
      lines.push("The organisation has no active signing certificate; an administrator adds one under Settings → Signing.");
    } else lines.push(`Sealed with: ${pre.certificate}.`);
    if (pre.balancedByActor) {
      blocked = true;
      lines.push("You closed this revision's balance yourself; another signatory must sign it.");
    }
  }
  return { blocked, lines };
}

/** Current state, the actions the actor's roles allow with their preconditions, and what others must do. */
export function LifecyclePanel(p: LifecyclePanelProps) {
  const rules = transitionsFrom(p.state);
  return (
    <section aria-labelledby="lifecycle" className="space-y-3 border border-rule bg-white px-4 py-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="lifecycle" className="text-base font-semibold">
          Review and sign-off
        </h2>
        <p className="text-sm">
          <MonthStateBadge state={p.state} /> <span className="num ml-2 text-ink-soft">revision {p.revision}</span>
        </p>
      </div>
      <ol className="flex flex-wrap gap-1 text-xs text-ink-soft" aria-label="Life cycle">
        {(["open", "balanced", "in_review", "signed", "submitted"] as const).map((s, i) => (
          <li key={s} className={`border px-2 py-0.5 ${s === p.state ? "border-accent bg-accent-wash font-semibold text-ink" : "border-rule"}`} aria-current={s === p.state ? "step" : undefined}>
            {i + 1}. {STATE_LABELS[s]}
          </li>
        ))}
      </ol>
      {rules.length === 0 ? <p className="text-sm text-ink-soft">No further step.</p> : null}
      <div className="space-y-4">
        {rules.map((rule) => {
          const allowed = mayPerform(p.roles, rule.name);
          const h = hints(rule, p.pre);
          return (
            <div key={rule.name} className="border-t border-rule pt-3">
              <h3 className="text-sm font-semibold">
                {rule.label} <span className="font-normal text-ink-soft">→ {STATE_LABELS[rule.to]}</span>
              </h3>
              <p className="max-w-prose text-sm text-ink-soft">{rule.explains}</p>
              {h.lines.length ? (
                <ul className="mt-1 list-disc pl-5 text-sm">
                  {h.lines.map((l) => (
                    <li key={l}>{l}</li>
                  ))}
                </ul>
              ) : null}
              <div className="mt-2">
                {!allowed ? (
                  <p className="text-sm text-ink-soft">Done by: {rolesText(rule.name)}. Your roles do not include it.</p>
                ) : h.blocked ? (
                  <p className="text-sm text-warn">Not possible yet: see above.</p>
                ) : rule.name === "sign" && p.sign ? (
                  <SignForm action={p.action} siteId={p.siteId} period={p.period} version={p.version} {...p.sign} />
                ) : (
                  <TransitionForm
                    action={p.action}
                    siteId={p.siteId}
                    period={p.period}
                    version={p.version}
                    transition={rule.name}
                    buttonLabel={rule.label}
                    primary={rule.name !== "return" && rule.name !== "reopen"}
                    reason={rule.reason === "always" || (rule.reason === "outside-tolerance" && p.pre.outside.length > 0) ? "required" : rule.reason === "none" ? "none" : "optional"}
                    reasonLabel={rule.name === "return" ? "Comments for the officer" : rule.name === "balance" ? "Why the balance does not close" : undefined}
                    submission={rule.name === "record-submission"}
                  />
                )}
              </div>
            </div>
          );
        })}
      </div>
    </section>
  );
}
