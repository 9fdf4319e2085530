"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useEffect, useMemo, useRef, useState, useTransition } from "react";
import { useForm, useWatch, type Path } from "react-hook-form";
import { createStream, editStream } from "@/app/(app)/settings/sites/actions";
import { Notice } from "@/components/ui/status";
import { buttonPrimary, buttonSecondary, input } from "@/components/ui/styles";
import { UNITS_BY_KIND } from "@/lib/balance/schema";
import { DESTINATIONS, FATES, STREAM_KINDS } from "@/lib/balance/types";
import type { Unit } from "@/lib/balance/units";
import type { ActionResult } from "@/lib/auth/guard";
import { INDIRECT_FACTOR_UNIT, MAY_HAVE_ANALYSIS, NEEDS_ANALYSIS, STREAM_KIND_LABELS, streamSchema, type StreamInput, type StreamValues } from "@/lib/validations/stream";
import { FormField, invalidProps } from "./form-field";

/**
 * One stream of a site. Fields that do not apply to the chosen kind are hidden and emptied, and
 * the unit list follows the kind, so the form can only produce a stream the engine accepts.
 */
export function StreamForm({ siteId, streamId, defaults, analysisKeys }: { siteId: string; streamId?: string; defaults: StreamInput; analysisKeys: string[] }) {
  const router = useRouter();
  const [result, setResult] = useState<ActionResult<unknown> | null>(null);
  const [pending, start] = useTransition();
  const form = useForm<StreamInput, unknown, StreamValues>({ resolver: zodResolver(streamSchema), defaultValues: defaults });
  const { register, handleSubmit, setError, setValue, getValues, formState, control } = form;
  const kind = useWatch({ control, name: "kind" });
  const metered = useWatch({ control, name: "metered" });
  const units = useMemo(() => UNITS_BY_KIND[kind] ?? [], [kind]);
  const err = (k: keyof StreamInput) => formState.errors[k]?.message;

  // A new kind starts from its usual unit (a feed-gas stream in Sm3, not the tonnes an ammonia stream had);
  // on first load the stored unit stays.
  const loadedKind = useRef(defaults.kind);
  useEffect(() => {
    const changed = kind !== loadedKind.current;
    loadedKind.current = kind;
    if (changed || !units.includes(getValues("unit") as Unit)) setValue("unit", units[0] ?? "", { shouldDirty: changed });
    if (!MAY_HAVE_ANALYSIS.includes(kind)) setValue("analysisKey", "");
    if (kind !== "purge-gas") setValue("fate", "");
    if (kind !== "co2-export") setValue("destination", "");
    if (!INDIRECT_FACTOR_UNIT[kind]) setValue("indirectFactor", "");
  }, [kind, units, getValues, setValue]);
  // No meter: no meter facts either (the schema refuses them).
  useEffect(() => {
    if (metered) return;
    for (const k of ["uncertaintyPct", "systematicPct", "meterTag", "calibratedOn", "calibrationIntervalMonths"] as const) setValue(k, "");
  }, [metered, setValue]);

  // The action parses the raw text again with the same schema: the server never trusts the browser's parse.
  const onSubmit = handleSubmit(() =>
    start(async () => {
      const raw = getValues();
      const r = streamId ? await editStream(siteId, streamId, raw) : await createStream(siteId, raw);
      setResult(r);
      if (!r.ok) {
        for (const [k, message] of Object.entries(r.errors ?? {})) setError(k as Path<StreamInput>, { message });
        return;
      }
      form.reset(getValues());
      router.push(`/settings/sites/${siteId}`);
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {result && !result.ok ? <Notice tone="fault">{result.message}</Notice> : null}
      <div className="grid gap-4 sm:grid-cols-[1fr_2fr_1fr]">
        <FormField id="stream-key" label="Key" hint="Names the stream in files, imports and the API." error={err("key")}>
          <input id="stream-key" autoComplete="off" className={`${input} num`} {...register("key")} {...invalidProps("stream-key", err("key"))} />
        </FormField>
        <FormField id="stream-name" label="Name" error={err("name")}>
          <input id="stream-name" autoComplete="off" className={input} {...register("name")} {...invalidProps("stream-name", err("name"))} />
        </FormField>
        <FormField id="stream-order" label="Order in forms" error={err("sortOrder")}>
          <input id="stream-order" inputMode="numeric" className={`${input} num text-right`} {...register("sortOrder")} {...invalidProps("stream-order", err("sortOrder"))} />
        </FormField>
      </div>
      <div className="grid gap-4 sm:grid-cols-3">
        <FormField id="stream-kind" label="Kind" error={err("kind")}>
          <select id="stream-kind" className={input} {...register("kind")} {...invalidProps("stream-kind", err("kind"))}>
            {STREAM_KINDS.map((k) => (
              <option key={k} value={k}>
                {STREAM_KIND_LABELS[k]}
              </option>
            ))}
          </select>
        </FormField>
        <FormField id="stream-unit" label="Usual unit" hint={`Units for this kind: ${units.join(", ")}.`} error={err("unit")}>
          <select id="stream-unit" className={`${input} num`} {...register("unit")} {...invalidProps("stream-unit", err("unit"))}>
            {units.map((u) => (
              <option key={u} value={u}>
                {u}
              </option>
            ))}
          </select>
        </FormField>
        {MAY_HAVE_ANALYSIS.includes(kind) ? (
          <FormField
            id="stream-analysis"
            label={NEEDS_ANALYSIS.includes(kind) ? "Analysis key" : "Analysis key (optional: dry air otherwise)"}
            hint="The gas analysis that gives the composition; same key for streams of the same gas."
            error={err("analysisKey")}
          >
            <input id="stream-analysis" list="analysis-keys" autoComplete="off" className={`${input} num`} {...register("analysisKey")} {...invalidProps("stream-analysis", err("analysisKey"))} />
            <datalist id="analysis-keys">
              {analysisKeys.map((k) => (
                <option key={k} value={k} />
              ))}
            </datalist>
          </FormField>
        ) : null}
        {kind === "purge-gas" ? (
          <FormField id="stream-fate" label="Fate" hint="Burnt as fuel, flared or vented." error={err("fate")}>
            <select id="stream-fate" className={input} {...register("fate")} {...invalidProps("stream-fate", err("fate"))}>
              <option value="">Choose…</option>
              {FATES.map((f) => (
                <option key={f} value={f}>
                  {f}
                </option>
              ))}
            </select>
          </FormField>
        ) : null}
        {kind === "co2-export" ? (
          <FormField id="stream-destination" label="Destination" error={err("destination")}>
            <select id="stream-destination" className={input} {...register("destination")} {...invalidProps("stream-destination", err("destination"))}>
              <option value="">Choose…</option>
              {DESTINATIONS.map((d) => (
                <option key={d} value={d}>
                  {d === "pcc" ? "precipitated calcium carbonate (pcc)" : d}
                </option>
              ))}
            </select>
          </FormField>
        ) : null}
        {INDIRECT_FACTOR_UNIT[kind] ? (
          <FormField id="stream-factor" label={`Indirect factor (${INDIRECT_FACTOR_UNIT[kind]})`} hint="Optional; the factor set's default applies otherwise." error={err("indirectFactor")}>
            <input id="stream-factor" inputMode="decimal" autoComplete="off" className={`${input} num text-right`} {...register("indirectFactor")} {...invalidProps("stream-factor", err("indirectFactor"))} />
          </FormField>
        ) : null}
      </div>
      <div className="flex items-start gap-2">
        <input id="stream-unmetered" type="checkbox" className="mt-1 size-4 accent-accent" checked={!metered} onChange={(e) => setValue("metered", !e.target.checked, { shouldDirty: true })} aria-describedby="stream-unmetered-hint" />
        <div>
          <label htmlFor="stream-unmetered" className="text-sm font-medium">
            No meter measures this flow
          </label>
          <p id="stream-unmetered-hint" className="text-xs text-ink-soft">
            The reconciliation solves for it from the other meters instead of moving them; a figure entered in the month is kept only as an estimate where the balances cannot fix it.
          </p>
        </div>
      </div>
      {metered ? (
      <div className="grid gap-4 sm:grid-cols-5">
        <FormField id="stream-unc" label="Uncertainty (± %, 95 %)" hint="Of the monthly total; used by reconciliation." error={err("uncertaintyPct")}>
          <input id="stream-unc" inputMode="decimal" autoComplete="off" className={`${input} num text-right`} {...register("uncertaintyPct")} {...invalidProps("stream-unc", err("uncertaintyPct"))} />
        </FormField>
        <FormField id="stream-sys" label="Repeating share (%)" hint="Of the uncertainty, the part that repeats every month until the meter is recalibrated; empty: all of it." error={err("systematicPct")}>
          <input id="stream-sys" inputMode="decimal" autoComplete="off" className={`${input} num text-right`} {...register("systematicPct")} {...invalidProps("stream-sys", err("systematicPct"))} />
        </FormField>
        <FormField id="stream-tag" label="Meter tag" error={err("meterTag")}>
          <input id="stream-tag" autoComplete="off" className={`${input} num`} {...register("meterTag")} {...invalidProps("stream-tag", err("meterTag"))} />
        </FormField>
        <FormField id="stream-cal" label="Last calibrated" error={err("calibratedOn")}>
          <input id="stream-cal" type="date" className={`${input} num`} {...register("calibratedOn")} {...invalidProps("stream-cal", err("calibratedOn"))} />
        </FormField>
        <FormField id="stream-cal-every" label="Calibrated every (months)" hint="The site's own rule; empty: no reminder." error={err("calibrationIntervalMonths")}>
          <input id="stream-cal-every" inputMode="numeric" autoComplete="off" className={`${input} num text-right`} {...register("calibrationIntervalMonths")} {...invalidProps("stream-cal-every", err("calibrationIntervalMonths"))} />
        </FormField>
      </div>
      ) : null}
      <div className="flex items-center gap-3">
        <button type="submit" className={buttonPrimary} disabled={pending}>
          {pending ? "Saving…" : streamId ? "Save stream" : "Add stream"}
        </button>
        <button type="button" className={buttonSecondary} onClick={() => router.push(`/settings/sites/${siteId}`)}>
          Cancel
        </button>
      </div>
    </form>
  );
}
