"use client";

import { useRouter } from "next/navigation";
import { AttachmentList } from "@/components/attachments/attachment-list";
import { useEffect, useRef, useState, useSyncExternalStore, useTransition } from "react";
import { FormProvider, useForm, type FieldPath } from "react-hook-form";
import { loadSavedMonth, saveMonthForm } from "@/app/(app)/sites/[siteId]/months/[month]/actions";
import { Notice } from "@/components/ui/status";
import { buttonPrimary } from "@/components/ui/styles";
import type { IssueDetail } from "@/lib/auth/errors";
import { AnalysisEditor } from "./analysis-editor";
import { ConflictNotice } from "./conflict-notice";
import { LiveBalancePanel } from "./live-balance-panel";
import { monthResolver } from "./month-resolver";
import { formPath, toFigures, type MonthFormValues, type StreamInfo } from "./month-values";
import { ReadingsTable } from "./readings-table";
import { useLiveBalance } from "./use-live-balance";
import { useUnsavedGuard } from "./use-unsaved-guard";
import type { LiveContext } from "./live-calculation";

export interface MonthEntryProps {
  siteId: string;
  period: string;
  version: number;
  context: Omit<LiveContext, "streams">;
  streams: StreamInfo[];
  initial: MonthFormValues;
  /** Why the figures cannot be changed here, or null when the signed-in person may edit them. */
  readOnlyReason: string | null;
  previous: { period: string; analyses: Record<string, Record<string, string>> } | null;
}

const noSubscribe = () => () => {};

type Outcome = { tone: "ok" | "fault"; message: string; unplaced?: string[] } | null;

export function MonthEntryForm({
  siteId,
  period,
  version: openedVersion,
  context,
  streams,
  initial,
  readOnlyReason,
  previous,
}: MonthEntryProps) {
  const router = useRouter();
  const formRef = useRef<HTMLFormElement>(null);
  const [version, setVersion] = useState(openedVersion);
  const [outcome, setOutcome] = useState<Outcome>(null);
  const [conflict, setConflict] = useState<{ message: string; changes: IssueDetail[] } | null>(
    null,
  );
  const [reloading, setReloading] = useState(false);
  // Until React has taken over, the server-rendered form must not submit natively (it would GET the page).
  const interactive = useSyncExternalStore(
    noSubscribe,
    () => true,
    () => false,
  );
  const [saving, startSaving] = useTransition();
  const form = useForm<MonthFormValues>({
    resolver: monthResolver,
    defaultValues: initial,
    mode: "onTouched",
  });
  const { handleSubmit, getValues, reset, setError, formState, control } = form;
  const readOnly = readOnlyReason !== null;
  const live = useLiveBalance(control, { ...context, streams });
  useUnsavedGuard(formState.isDirty && !readOnly, formRef);

  // "Load their figures": fetch the month as saved now and replace the form with it, on request only.
  const loadTheirs = async () => {
    setReloading(true);
    const r = await loadSavedMonth(siteId, period);
    setReloading(false);
    if (!r.ok || !r.data) {
      setOutcome({ tone: "fault", message: r.ok ? "The month could not be loaded." : r.message });
      return;
    }
    reset(r.data.initial);
    setVersion(r.data.version);
    setConflict(null);
    setOutcome({ tone: "ok", message: `Loaded the figures saved in version ${r.data.version}.` });
    router.refresh();
  };

  const save = handleSubmit(() =>
    startSaving(async () => {
      const values = getValues();
      const { figures, map } = toFigures(values, version);
      const r = await saveMonthForm(siteId, period, figures);
      if (r.ok) {
        setVersion(r.data!.version);
        setConflict(null);
        reset(values);
        setOutcome({ tone: "ok", message: `${r.message} Version ${r.data!.version}.` });
        return;
      }
      if (r.code === "version_conflict") {
        setOutcome(null);
        setConflict({ message: r.message, changes: r.changes ?? [] });
        return;
      }
      const unplaced: string[] = [];
      let first = true;
      for (const [path, message] of Object.entries(r.errors ?? {})) {
        const field = formPath(path, map, values);
        if (field) {
          setError(
            field as FieldPath<MonthFormValues>,
            { type: "server", message },
            { shouldFocus: first },
          );
          first = false;
        } else unplaced.push(`${path}: ${message}`);
      }
      setOutcome({ tone: "fault", message: r.message, unplaced });
    }),
  );

  // Ctrl+S / Cmd+S saves from anywhere on the page instead of saving the HTML.
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if ((e.ctrlKey || e.metaKey) && !e.altKey && e.key.toLowerCase() === "s") {
        e.preventDefault();
        if (!readOnly) formRef.current?.requestSubmit();
      }
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [readOnly]);

  const analysisUsers = (key: string) =>
    streams.filter((s) => s.analysisKey === key && !s.archived).map((s) => s.key);

  return (
    <FormProvider {...form}>
      <div className="grid items-start gap-5 lg:grid-cols-[minmax(0,1fr)_19rem]">
        <div className="min-w-0 space-y-6">
          <form
            ref={formRef}
            onSubmit={save}
            noValidate
            aria-label="Monthly figures"
            data-interactive={interactive ? "" : undefined}
            className="min-w-0 space-y-5"
          >
            {readOnly ? (
              <Notice tone="locked" title="Read only">
                {readOnlyReason}
              </Notice>
            ) : null}
            {conflict ? (
              <ConflictNotice
                message={conflict.message}
                changes={conflict.changes}
                loading={reloading}
                onLoadTheirs={loadTheirs}
              />
            ) : null}
            {outcome ? (
              <Notice tone={outcome.tone} title={outcome.tone === "ok" ? undefined : "Not saved"}>
                {outcome.message}
                {outcome.unplaced?.length ? (
                  <ul className="mt-1 list-inside list-disc text-sm">
                    {outcome.unplaced.map((u) => (
                      <li key={u} className="num">
                        {u}
                      </li>
                    ))}
                  </ul>
                ) : null}
              </Notice>
            ) : null}
            <fieldset disabled={readOnly} className="min-w-0 space-y-5">
              <legend className="sr-only">Meter totals and gas analyses</legend>
              <section aria-labelledby="readings-heading" className="space-y-2">
                <h2 id="readings-heading" className="text-base font-semibold">
                  Meter totals
                </h2>
                <ReadingsTable streams={streams} />
                <p className="text-xs text-ink-soft">
                  Type exact figures with a dot for decimals; an empty total removes the
                  month&rsquo;s reading of that stream.
                </p>
              </section>
              <section aria-labelledby="analyses-heading" className="space-y-2">
                <h2 id="analyses-heading" className="text-base font-semibold">
                  Gas analyses
                </h2>
                {initial.analyses.length === 0 ? (
                  <p className="text-sm text-ink-soft">No stream of this site names an analysis.</p>
                ) : null}
                <div className="grid gap-3 xl:grid-cols-2">
                  {initial.analyses.map((a, i) => (
                    <AnalysisEditor
                      key={a.key}
                      index={i}
                      first={i === 0}
                      readOnly={readOnly}
                      usedBy={analysisUsers(a.key)}
                      previous={
                        previous?.analyses[a.key]
                          ? { period: previous.period, components: previous.analyses[a.key] }
                          : undefined
                      }
                    />
                  ))}
                </div>
              </section>
            </fieldset>
            {!readOnly ? (
              <div className="sticky bottom-0 -mx-1 flex flex-wrap items-center gap-3 border-t border-rule bg-paper/95 px-1 py-2.5">
                <button
                  id="month-save"
                  type="submit"
                  className={buttonPrimary}
                  disabled={saving || !interactive}
                >
                  {saving ? "Saving…" : "Save figures"}
                </button>
                <span className="text-sm text-ink-soft">
                  <kbd className="num">Ctrl</kbd>+<kbd className="num">S</kbd> saves ·{" "}
                  <kbd className="num">Enter</kbd> moves to the next total
                </span>
                <span className="ml-auto text-sm" aria-live="polite">
                  {formState.isDirty ? "Unsaved changes" : `Saved · version ${version}`}
                </span>
              </div>
            ) : null}
          </form>
          {/* Outside the figures form: the upload has a form of its own, and forms cannot nest. */}
          <AttachmentList siteId={siteId} month={period} canUpload={!readOnly} />
        </div>
        <aside className="lg:sticky lg:top-4">
          <LiveBalancePanel
            outcome={live.outcome}
            pending={live.pending}
            tolerancePct={context.tolerancePct}
            readOnly={readOnly}
          />
        </aside>
      </div>
    </FormProvider>
  );
}
