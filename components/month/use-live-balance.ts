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
  const [state, setState] = useState<{ key: string; outcome: LiveOutcome } | null>(null);
  useEffect(() => {
    const t = setTimeout(() => setState({ key, outcome: liveCalculation(JSON.parse(key) as MonthFormValues, ctx) }), state ? DEBOUNCE_MS : 0);
    return () => clearTimeout(t);
    // ctx is fixed while the form is open; recompute on value changes only.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);
  return { outcome: state?.outcome ?? null, pending: state?.key !== key };
}
