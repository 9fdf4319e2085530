"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { useForm, type Path } from "react-hook-form";
import { createSite, editSite } from "@/app/(app)/settings/sites/actions";
import { Notice } from "@/components/ui/status";
import { buttonPrimary, input } from "@/components/ui/styles";
import { EMISSION_METHODS, GWP_SETS } from "@/lib/balance/types";
import type { ActionResult } from "@/lib/auth/guard";
import {
  EMISSIONS_METHOD_LABELS,
  FACTOR_SET_OPTIONS,
  METERING_REFERENCES,
  METERING_REFERENCE_LABELS,
  siteSchema,
  type SiteInput,
  type SiteValues,
} from "@/lib/validations/site";
import { FormField, invalidProps } from "./form-field";

/** Creates a site (no siteId) or edits one. The same zod schema checks here and in the action. */
export function SiteForm({ siteId, defaults }: { siteId?: string; defaults: SiteInput }) {
  const router = useRouter();
  const [result, setResult] = useState<ActionResult<unknown> | null>(null);
  const [pending, start] = useTransition();
  const form = useForm<SiteInput, unknown, SiteValues>({ resolver: zodResolver(siteSchema), defaultValues: defaults });
  const { register, handleSubmit, setError, formState } = form;
  const err = (k: keyof SiteInput) => formState.errors[k]?.message;

  const onSubmit = handleSubmit((values) =>
    start(async () => {
      const r = siteId ? await editSite(siteId, values) : await createSite(values);
      setResult(r);
      if (!r.ok) {
        for (const [k, message] of Object.entries(r.errors ?? {})) setError(k as Path<SiteInput>, { message });
        return;
      }
      form.reset(values);
      // A new site goes straight to its own page, where its streams are added next.
      if (!siteId && r.data && typeof r.data === "object" && "id" in r.data) router.push(`/settings/sites/${String(r.data.id)}?created=1`);
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {result ? <Notice tone={result.ok ? "ok" : "fault"}>{result.message}</Notice> : null}
      <div className="grid gap-4 sm:grid-cols-[2fr_1fr]">
        <FormField id="site-name" label="Name" error={err("name")}>
          <input id="site-name" autoComplete="off" className={input} {...register("name")} {...invalidProps("site-name", err("name"))} />
        </FormField>
        <FormField id="site-code" label="Code" hint="Short, lower-case; unique in your organisation." error={err("code")}>
          <input id="site-code" autoComplete="off" className={`${input} num`} {...register("code")} {...invalidProps("site-code", err("code"))} />
        </FormField>
      </div>
      <div className="grid gap-4 sm:grid-cols-3">
        <FormField id="site-ref" label="Metering reference" hint="Conditions the site's gas meters report at." error={err("meteringReference")}>
          <select id="site-ref" className={input} {...register("meteringReference")} {...invalidProps("site-ref", err("meteringReference"))}>
            {METERING_REFERENCES.map((r) => (
              <option key={r} value={r}>
                {METERING_REFERENCE_LABELS[r]}
              </option>
            ))}
          </select>
        </FormField>
        <FormField id="site-tol" label="Balance tolerance (%)" hint="How far a closure may be from 0 % and still count as closed." error={err("closureTolerancePct")}>
          <div className="flex items-center gap-1.5">
            <input id="site-tol" inputMode="decimal" autoComplete="off" className={`${input} num text-right`} {...register("closureTolerancePct")} {...invalidProps("site-tol", err("closureTolerancePct"))} />
            <span className="num text-ink-soft">%</span>
          </div>
        </FormField>
        <FormField id="site-gwp" label="GWP set" hint="IPCC assessment report the CO2e figures use." error={err("gwp")}>
          <select id="site-gwp" className={input} {...register("gwp")} {...invalidProps("site-gwp", err("gwp"))}>
            {GWP_SETS.map((g) => (
              <option key={g} value={g}>
                {g}
              </option>
            ))}
          </select>
        </FormField>
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <FormField id="site-factors" label="Factor set" error={err("factorSet")}>
          <select id="site-factors" className={input} {...register("factorSet")} {...invalidProps("site-factors", err("factorSet"))}>
            {FACTOR_SET_OPTIONS.map((f) => (
              <option key={f.id} value={f.id}>
                {f.id} — {f.name}
              </option>
            ))}
          </select>
        </FormField>
        <FormField id="site-method" label="Emissions method" hint="The method the site's regulator prescribes." error={err("emissionsMethod")}>
          <select id="site-method" className={input} {...register("emissionsMethod")} {...invalidProps("site-method", err("emissionsMethod"))}>
            {EMISSION_METHODS.map((m) => (
              <option key={m} value={m}>
                {EMISSIONS_METHOD_LABELS[m]}
              </option>
            ))}
          </select>
        </FormField>
      </div>
      <div className="flex items-center gap-3">
        <button type="submit" className={buttonPrimary} disabled={pending}>
          {pending ? "Saving…" : siteId ? "Save site" : "Set up site"}
        </button>
        {formState.isDirty && siteId ? <span className="text-sm text-ink-soft">Unsaved changes</span> : null}
      </div>
    </form>
  );
}
