"use client";

import { Status, type StatusTone } from "@/components/ui/status";
import { Dec } from "@/lib/balance/decimal";
import type { CalculationResult } from "@/lib/balance/calculate";
import { namedSuspects } from "@/lib/balance/suspects";
import { ClosureBeam } from "./closure-beam";
import type { LiveOutcome } from "./live-calculation";
import { formatDecimal, formatSigned } from "./number-format";

const SEVERITY_TONE: Record<string, StatusTone> = { error: "fault", warning: "warn", info: "info" };
const THREE = new Dec(3);

function ClosureRow({ name, closure, tolerance }: { name: string; closure: Dec | null; tolerance: Dec }) {
  const within = closure !== null && closure.abs().lte(tolerance);
  return (
    <div className="grid grid-cols-[5.5rem_1fr] items-center gap-x-2 gap-y-0.5 border-b border-rule py-2 last:border-0">
      <span className="text-sm font-medium">{name}</span>
      <span className="num text-right text-base">{closure ? `${formatSigned(closure, 2)} %` : "—"}</span>
      <span className="col-span-2 flex items-center justify-between gap-2 text-xs">
        <ClosureBeam closure={closure} tolerance={tolerance} />
        {closure === null ? (
          <Status tone="info">Not stated</Status>
        ) : within ? (
          <Status tone="ok">Closes</Status>
        ) : (
          <Status tone="warn">Outside ±{tolerance.toFixed()} %</Status>
        )}
      </span>
    </div>
  );
}

function Figures({ result, tolerance }: { result: CalculationResult; tolerance: Dec }) {
  const b = result.balances;
  const ratio = b.h2n2Ratio;
  const suspects = namedSuspects(result.reconciliation?.streams);
  // Intensities need a valid ammonia figure: without one they are not zero, they are unknown.
  const nh3 = result.feed.ammonia_t;
  const noAmmonia = !nh3 || nh3.isZero();
  return (
    <>
      <div>
        <ClosureRow name="Carbon" closure={b.carbon.closure_pct} tolerance={tolerance} />
        <ClosureRow name="Nitrogen" closure={b.nitrogen.closure_pct} tolerance={tolerance} />
        <ClosureRow name="Hydrogen" closure={b.hydrogen.closure_pct} tolerance={tolerance} />
      </div>
      <dl className="mt-2 space-y-1.5 text-sm">
        <div className="flex items-baseline justify-between gap-2">
          <dt>H2 : N2 make-up</dt>
          <dd className="num text-right">
            {ratio ? formatDecimal(ratio, 3) : "—"} <span className="text-ink-faint">vs 3</span>
            {ratio ? <span className="block text-xs text-ink-soft">{formatSigned(ratio.minus(THREE), 3)} from 3</span> : null}
          </dd>
        </div>
        <div className="flex items-baseline justify-between gap-2">
          <dt>Energy</dt>
          <dd className="num text-right">
            {noAmmonia || !result.feed.gj_lhv_per_t_nh3 ? "—" : formatDecimal(result.feed.gj_lhv_per_t_nh3, 2)} <span className="text-ink-faint">GJ (LHV)/t NH3</span>
          </dd>
        </div>
        <div className="flex items-baseline justify-between gap-2">
          <dt>CO2e intensity</dt>
          <dd className="num text-right">
            {noAmmonia || !result.emissions.intensity.co2e_t_per_t_nh3 ? "—" : formatDecimal(result.emissions.intensity.co2e_t_per_t_nh3, 3)}{" "}
            <span className="text-ink-faint">t CO2e/t NH3</span>
          </dd>
        </div>
        {noAmmonia ? <p className="text-xs text-ink-soft">No valid ammonia figure yet, so no intensity per tonne.</p> : null}
      </dl>
      {suspects.length ? (
        <p className="mt-2 text-sm">
          <Status tone="warn">Most likely wrong: {suspects.join(", ")}</Status>
        </p>
      ) : null}
      {result.flags.length ? (
        <ul className="mt-2 space-y-1 border-t border-rule pt-2 text-xs" aria-label="Engine flags">
          {result.flags.map((f, i) => (
            <li key={`${f.code}-${i}`} className="flex gap-1.5">
              <Status tone={SEVERITY_TONE[f.severity] ?? "info"}>
                <span className="sr-only">{f.severity}: </span>
              </Status>
              <span className="text-ink-soft">{f.message}</span>
            </li>
          ))}
        </ul>
      ) : null}
    </>
  );
}

/** The balance beside the form, recomputed in the browser shortly after typing stops. */
export function LiveBalancePanel({ outcome, tolerancePct, pending, readOnly }: { outcome: LiveOutcome | null; tolerancePct: string; pending: boolean; readOnly: boolean }) {
  const tolerance = new Dec(tolerancePct);
  return (
    <section aria-labelledby="live-balance" id="live-balance-panel" aria-busy={pending} className="border border-rule bg-white px-3 py-3">
      <div className="flex items-baseline justify-between gap-2">
        <h2 id="live-balance" className="text-base font-semibold">
          {readOnly ? "Balance" : "Balance as typed"}
        </h2>
        <span className="text-xs text-ink-soft" aria-live="polite">
          {pending ? "recalculating…" : outcome?.status === "ok" ? `${outcome.counted} readings` : ""}
        </span>
      </div>
      <p className="mb-1 text-xs text-ink-soft">Closure = (out − in) / in; tolerance ±{tolerance.toFixed()} %.</p>
      {!outcome || outcome.status === "empty" ? (
        <p className="py-3 text-sm text-ink-soft">{readOnly ? "No readings entered for this month yet." : "Enter readings and the balances appear here as you type."}</p>
      ) : outcome.status === "issues" ? (
        <div className="py-2 text-sm">
          <Status tone="warn">Cannot close the balance yet</Status>
          <ul className="mt-1 list-inside list-disc text-ink-soft">
            {outcome.issues.slice(0, 6).map((i, k) => (
              <li key={k}>
                {i.where}: {i.reason}
              </li>
            ))}
          </ul>
        </div>
      ) : (
        <Figures result={outcome.result} tolerance={tolerance} />
      )}
      {outcome && outcome.status !== "empty" && outcome.skipped.length ? (
        <p className="mt-2 text-xs text-ink-soft">Left out until they are numbers: {outcome.skipped.join(", ")}.</p>
      ) : null}
    </section>
  );
}
