import { Dec } from "@/lib/balance/decimal";

/**
 * A closure drawn as a beam around zero: the shaded band is the tolerance, the marker the
 * closure (left: less leaves than enters). Beyond three tolerances the marker stops at the end
 * and is drawn hollow, so an off-scale value is still visibly off-scale.
 */
export function ClosureBeam({ closure, tolerance }: { closure: Dec | null; tolerance: Dec }) {
  const W = 168;
  const mid = W / 2;
  const span = tolerance.times(3);
  const half = (W - 12) / 2;
  const band = tolerance.div(span).times(half).toNumber();
  let x: number | null = null;
  let clipped = false;
  if (closure) {
    const c = Dec.max(span.neg(), Dec.min(span, closure));
    clipped = !c.eq(closure);
    // Pixel position only: the figure itself is shown as text beside the beam.
    x = mid + c.div(span).times(half).toNumber();
  }
  return (
    <svg viewBox={`0 0 ${W} 22`} width={W} height={22} aria-hidden="true" className="block text-ink">
      <rect x={mid - band} y={6} width={band * 2} height={10} className="fill-accent-wash" />
      <line x1={6} x2={W - 6} y1={11} y2={11} stroke="currentColor" strokeWidth={1.25} />
      <line x1={mid} x2={mid} y1={3} y2={19} stroke="currentColor" strokeWidth={1} />
      <line x1={mid - band} x2={mid - band} y1={7} y2={15} className="stroke-accent" strokeWidth={1} />
      <line x1={mid + band} x2={mid + band} y1={7} y2={15} className="stroke-accent" strokeWidth={1} />
      {x !== null ? (
        <path d={`M${x} 10 l-4 -7 h8 z`} className={clipped ? "fill-white stroke-ink" : "fill-ink"} strokeWidth={1.25} />
      ) : null}
    </svg>
  );
}
