/**
 * A balance drawn as a beam on a pivot at zero: the arm reaches left (more out than in) or right
 * (more in than out) by the imbalance, over a shaded band that is the site's tolerance. Within
 * or outside is also said in words beside it, so the drawing is never the only signal.
 * Numbers arrive as decimal strings; converting to a float here only places pixels.
 */
import { Status } from "@/components/ui/status";

const W = 360;
const H = 72;
const MID = W / 2;
const HALF = 160;

/** A round axis limit a little beyond what must be shown. */
function niceExtent(x: number): number {
  const steps = [0.5, 1, 2, 2.5, 5, 10, 20, 25, 50, 100];
  return steps.find((s) => s >= x) ?? Math.ceil(x / 100) * 100;
}

function label(v: number, unit: string): string {
  const s = Math.abs(v) < 1e-9 ? "0" : `${v > 0 ? "+" : "\u2212"}${Math.abs(v)}`;
  return `${s}${unit ? ` ${unit}` : ""}`;
}

export interface BeamProps {
  title: string;
  /** Signed imbalance as decimal text, or null when the engine states none. */
  value: string | null;
  /** Half-width of the tolerance band, decimal text. */
  tolerance: string;
  unit: string;
  /** The figure as printed beside the beam, e.g. "+0.09 %". */
  valueText: string;
  detail?: string;
  /** What a move to each side means, e.g. "less out than in". */
  sides?: [string, string];
}

export function BalanceBeam({ title, value, tolerance, unit, valueText, detail, sides = ["less out than in", "more out than in"] }: BeamProps) {
  const tol = Math.abs(Number(tolerance));
  const v = value === null ? null : Number(value);
  const extent = niceExtent(Math.max(tol * 2, v === null ? 0 : Math.abs(v) * 1.15));
  const x = (n: number) => MID + (Math.max(-extent, Math.min(extent, n)) / extent) * HALF;
  const within = v === null || Math.abs(v) <= tol;
  const beamClass = within ? "stroke-ink" : "stroke-warn";
  const described =
    v === null ? `${title}: no closure stated` : `${title}: ${valueText}, tolerance ±${tol} ${unit}, ${within ? "within" : "outside"} tolerance`;

  return (
    <figure className="border border-rule bg-white px-4 py-3">
      <figcaption className="flex flex-wrap items-baseline justify-between gap-2">
        <span className="font-medium">{title}</span>
        <span className="flex items-baseline gap-3">
          <span className="num text-base">{valueText}</span>
          {v === null ? (
            <Status tone="info">No closure stated</Status>
          ) : within ? (
            <Status tone="ok">Within tolerance</Status>
          ) : (
            <Status tone="warn">Outside tolerance</Status>
          )}
        </span>
      </figcaption>
      <svg viewBox={`0 0 ${W} ${H}`} className="mt-2 h-[4.5rem] w-full" role="img" aria-label={described} preserveAspectRatio="xMidYMid meet">
        <rect x={x(-tol)} y={8} width={x(tol) - x(-tol)} height={26} className="fill-accent-wash" />
        <line x1={x(-tol)} x2={x(-tol)} y1={8} y2={34} className="stroke-accent" strokeDasharray="2 2" />
        <line x1={x(tol)} x2={x(tol)} y1={8} y2={34} className="stroke-accent" strokeDasharray="2 2" />
        <line x1={MID - HALF} x2={MID + HALF} y1={21} y2={21} className="stroke-rule-strong" strokeWidth={1} />
        {/* Pivot at zero. */}
        <path d={`M${MID} 24 l-6 12 h12 z`} className="fill-ink" />
        {v !== null ? (
          <>
            <line x1={MID} x2={x(v)} y1={21} y2={21} className={beamClass} strokeWidth={5} strokeLinecap="round" />
            <circle cx={x(v)} cy={21} r={4.5} className={within ? "fill-ink" : "fill-warn"} />
          </>
        ) : null}
        {[-extent, -tol, 0, tol, extent].map((t, i) => (
          <text key={i} x={x(t)} y={52} textAnchor="middle" className={`num fill-ink-soft ${t === 0 || Math.abs(t) === extent ? "" : "fill-accent-strong"}`} fontSize={10}>
            {label(t, i === 2 ? "" : unit)}
          </text>
        ))}
        <text x={MID - HALF} y={68} className="fill-ink-faint" fontSize={9}>
          ← {sides[0]}
        </text>
        <text x={MID + HALF} y={68} textAnchor="end" className="fill-ink-faint" fontSize={9}>
          {sides[1]} →
        </text>
      </svg>
      {detail ? <p className="mt-1 text-xs text-ink-soft">{detail}</p> : null}
    </figure>
  );
}
