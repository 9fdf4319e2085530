"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState, useTransition } from "react";
import { useFieldArray, useForm, type Path } from "react-hook-form";
import { saveInstallation } from "@/app/(app)/settings/sites/actions";
import { Notice } from "@/components/ui/status";
import { buttonPrimary, buttonSecondary, input } from "@/components/ui/styles";
import type { ActionResult } from "@/lib/auth/guard";
import { MAX_IDENTIFIERS, installationSchema, missingInstallationFields, type InstallationIdentity, type InstallationInput } from "@/lib/validations/installation";
import { FormField, invalidProps } from "./form-field";

/** Schemes people usually file under; any other name may be typed. */
const SCHEME_SUGGESTIONS = ["EU ETS permit", "EU ETS installation identifier", "CBAM installation", "UK ETS permit", "US EPA GHGRP facility ID", "National emissions register"];

/**
 * The installation identity of a site: saved as far as it is known; the site's months go for
 * sign-off once every field but the telephone is filled. The same schema checks here and on the server.
 */
export function InstallationForm({ siteId, defaults }: { siteId: string; defaults: InstallationIdentity }) {
  const [result, setResult] = useState<ActionResult<unknown> | null>(null);
  const [pending, start] = useTransition();
  const form = useForm<InstallationInput, unknown, InstallationIdentity>({ resolver: zodResolver(installationSchema), defaultValues: defaults });
  const { register, handleSubmit, setError, formState, control, watch } = form;
  const ids = useFieldArray({ control, name: "identifiers" });
  const err = (k: Path<InstallationInput>) => {
    const parts = k.split(".");
    let e: unknown = formState.errors;
    for (const p of parts) e = (e as Record<string, unknown> | undefined)?.[p];
    return (e as { message?: string } | undefined)?.message;
  };
  const missing = missingInstallationFields(watch() as InstallationIdentity);

  const onSubmit = handleSubmit((values) =>
    start(async () => {
      const r = await saveInstallation(siteId, values);
      setResult(r);
      if (!r.ok) {
        for (const [k, message] of Object.entries(r.errors ?? {})) setError(k as Path<InstallationInput>, { message });
        return;
      }
      form.reset(values);
    }),
  );

  const text = (id: string, name: Path<InstallationInput>, label: string, hint?: string, className = "", extra: Record<string, string> = {}) => (
    <FormField id={id} label={label} hint={hint} error={err(name)} className={className}>
      <input id={id} autoComplete="off" className={input} {...extra} {...register(name)} {...invalidProps(id, err(name))} />
    </FormField>
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {result ? <Notice tone={result.ok ? "ok" : "fault"}>{result.message}</Notice> : null}
      {missing.length ? (
        <Notice tone="warn" title="Needed before a month of this site can go for sign-off">
          {missing.map((m) => m.label).join("; ")}.
        </Notice>
      ) : (
        <p className="text-sm text-ink-soft">Complete: printed on page 1 of every statement and frozen with each revision sent for sign-off.</p>
      )}
      <div className="grid gap-4 sm:grid-cols-2">
        {text("inst-operator", "operatorName", "Operator's legal name", "As it appears on the permit.")}
        {text("inst-authority", "competentAuthority", "Competent authority", "The authority the statements are filed with.")}
      </div>
      <FormField id="inst-address" label="Installation address" error={err("address")}>
        <textarea id="inst-address" rows={2} className={input} {...register("address")} {...invalidProps("inst-address", err("address"))} />
      </FormField>

      <fieldset className="space-y-2">
        <legend className="text-sm font-medium text-ink">Identifiers</legend>
        <p className="text-xs text-ink-soft">One row per scheme: permit number, installation identifier, registry or facility id.</p>
        <datalist id="inst-schemes">
          {SCHEME_SUGGESTIONS.map((s) => (
            <option key={s} value={s} />
          ))}
        </datalist>
        {ids.fields.map((f, i) => (
          <div key={f.id} className="grid items-end gap-2 sm:grid-cols-[1fr_1fr_auto]">
            {text(`inst-scheme-${i}`, `identifiers.${i}.scheme`, `Scheme ${i + 1}`, undefined, "", { list: "inst-schemes" })}
            {text(`inst-id-${i}`, `identifiers.${i}.identifier`, `Identifier ${i + 1}`, undefined, "", { className: `${input} num` })}
            <button type="button" className={`${buttonSecondary} mb-[1.4rem] sm:mb-0`} onClick={() => ids.remove(i)} aria-label={`Remove identifier ${i + 1}`}>
              Remove
            </button>
          </div>
        ))}
        {ids.fields.length < MAX_IDENTIFIERS ? (
          <button type="button" className={buttonSecondary} onClick={() => ids.append({ scheme: "", identifier: "" })}>
            Add an identifier
          </button>
        ) : null}
      </fieldset>

      <div className="grid gap-4 sm:grid-cols-[2fr_1fr]">
        {text("inst-plan", "monitoringPlanRef", "Monitoring-plan reference", "As approved by the competent authority.")}
        {text("inst-plan-version", "monitoringPlanVersion", "Version")}
      </div>
      <div className="grid gap-4 sm:grid-cols-3">
        {text("inst-contact", "contactName", "Reporting contact")}
        {text("inst-email", "contactEmail", "Contact e-mail", undefined, "", { type: "email", inputMode: "email" })}
        {text("inst-phone", "contactPhone", "Contact telephone (optional)", undefined, "", { type: "tel", inputMode: "tel" })}
      </div>
      <div className="flex items-center gap-3">
        <button type="submit" className={buttonPrimary} disabled={pending}>
          {pending ? "Saving…" : "Save installation identity"}
        </button>
        {formState.isDirty ? <span className="text-sm text-ink-soft">Unsaved changes</span> : null}
      </div>
    </form>
  );
}
