"use client";

import { useActionState, useState } from "react";
import { buttonSecondary, input } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";

export interface ExplainContext {
  siteId: string;
  period: string;
  action: (prev: ActionResult | null, formData: FormData) => Promise<ActionResult>;
}

/** The explanation of one flag: shown, and written or rewritten in place by the engineer or officer. */
export function ExplainFlagForm({ ctx, code, stream, current, by }: { ctx: ExplainContext; code: string; stream: string; current: string; by: string }) {
  const [state, action, pending] = useActionState<ActionResult | null, FormData>(ctx.action, null);
  const [open, setOpen] = useState(false);
  const id = `explain-${code}-${stream}`;
  if (!open) {
    return (
      <div className="space-y-1">
        {current ? (
          <p>
            {current} <span className="text-xs text-ink-soft">({by})</span>
          </p>
        ) : (
          <p className="text-ink-faint">no explanation recorded</p>
        )}
        {state?.ok ? <p className="text-xs text-accent-strong" role="status">{state.message}</p> : null}
        <button type="button" className="text-xs text-accent-strong underline" onClick={() => setOpen(true)}>
          {current ? "Rewrite the explanation" : "Explain this flag"}
        </button>
      </div>
    );
  }
  return (
    <form action={action} className="space-y-1.5" onSubmit={() => setOpen(false)}>
      <input type="hidden" name="siteId" value={ctx.siteId} />
      <input type="hidden" name="period" value={ctx.period} />
      <input type="hidden" name="code" value={code} />
      <input type="hidden" name="stream" value={stream} />
      <label htmlFor={id} className="sr-only">
        Explanation of {code}
      </label>
      <textarea id={id} name="text" rows={3} defaultValue={current} className={`${input} text-sm`} aria-describedby={`${id}-hint`} />
      <p id={`${id}-hint`} className="text-xs text-ink-soft">
        At least 10 characters; printed on the statement with your name.
      </p>
      {state && !state.ok ? <p className="text-xs text-fault">{state.message}</p> : null}
      <div className="flex gap-2">
        <button type="submit" className={buttonSecondary} disabled={pending}>
          {pending ? "Saving…" : "Save explanation"}
        </button>
        <button type="button" className="text-xs text-ink-soft underline" onClick={() => setOpen(false)}>
          Cancel
        </button>
      </div>
    </form>
  );
}
