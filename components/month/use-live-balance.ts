"use client";

import { useEffect, useMemo, useState } from "react";
import { useWatch, type Control } from "react-hook-form";
import { liveCalculation, type LiveContext, type LiveOutcome } from "./live-calculation";
import type { MonthFormValues } from "./month-values";

/** Milliseconds of quiet typing before the engine runs (a full run with reconciliation takes ~35 ms). */
const DEBOUNCE_MS = 300;

/** Recomputes the balance from the form's values shortly after each change. */
export function useLiveBalance(control: Control<MonthFormValues>, ctx: LiveContext): { outcome: LiveOutcome | null; pending: boolean } {
  const values = useWatch({ control }) as MonthFormValues;
  const key = useMemo(() => JSON.stringify(values), [values]);
  // The first result is computed during render (on the server too), so the page arrives with its balance.
  const [state, setState] = useState<{ key: string; outcome: LiveOutcome }>(() => ({ key, outcome: liveCalculation(values, ctx) }));
  useEffect(() => {
    if (key === state.key) return;
    const t = setTimeout(() => setState({ key, outcome: liveCalculation(JSON.parse(key) as MonthFormValues, ctx) }), DEBOUNCE_MS);
    return () => clearTimeout(t);
    // ctx is fixed while the form is open; recompute on value changes only.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);
  return { outcome: state.outcome, pending: state.key !== key };
}
