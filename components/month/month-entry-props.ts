import "server-only";
import type { MonthBundle } from "@/db/queries/months";
import { COMPONENTS } from "@/lib/balance/components";
import { UNITS_BY_KIND } from "@/lib/balance/schema";
import type { StreamKind } from "@/lib/balance/types";
import type { MonthFormValues, Source, StreamInfo } from "./month-values";

/**
 * Rows of the month form from what the database holds: every active stream, plus archived
 * streams that still have a reading this month (so an old month shows all it was computed from).
 */
export function monthEntryProps(bundle: MonthBundle, previous: { period: string; analyses: { key: string; components: Record<string, string> }[] } | null) {
  const byStream = new Map(bundle.readings.map((r) => [r.streamId, r]));
  const shown = bundle.streams.filter((s) => s.archivedAt === null || byStream.has(s.id));
  const streams: StreamInfo[] = shown.map((s) => {
    const r = byStream.get(s.id);
    const units = [...UNITS_BY_KIND[s.kind as StreamKind]];
    if (r && !units.includes(r.unit as never)) units.push(r.unit as never);
    return {
      id: s.id,
      key: s.key,
      name: s.name,
      kind: s.kind,
      unit: s.unit,
      units,
      analysisKey: s.analysisKey,
      destination: s.destination,
      fate: s.fate,
      uncertaintyPct: s.uncertaintyPct,
      metered: s.metered,
      systematicPct: s.systematicPct,
      calibratedOn: s.calibratedOn,
      indirectFactor: s.indirectFactor,
      meterTag: s.meterTag,
      sortOrder: s.sortOrder,
      archived: s.archivedAt !== null,
      hadReading: !!r,
    };
  });
  const readings = shown.map((s) => {
    const r = byStream.get(s.id);
    return { stream: s.key, quantity: r?.quantity ?? "", unit: r?.unit ?? s.unit, source: (r?.source ?? "meter") as Source, note: r?.note ?? "" };
  });
  const saved = new Map(bundle.analyses.map((a) => [a.key, a]));
  const keys = [...new Set([...shown.filter((s) => s.archivedAt === null).flatMap((s) => (s.analysisKey ? [s.analysisKey] : [])), ...saved.keys()])].sort();
  const analyses = keys.map((key) => {
    const a = saved.get(key);
    const comps = a?.components ?? {};
    return {
      key,
      components: COMPONENTS.filter((c) => comps[c] !== undefined).map((c) => ({ component: c, value: comps[c] })),
      sampledOn: a?.sampledOn ?? "",
      laboratory: a?.laboratory ?? "",
      carbonUncertaintyPct: a?.carbonUncertaintyPct ?? "",
      cvUncertaintyPct: a?.cvUncertaintyPct ?? "",
      note: a?.note ?? "",
      saved: !!a,
    };
  });
  const initial: MonthFormValues = { readings, analyses };
  const prev = previous ? { period: previous.period, analyses: Object.fromEntries(previous.analyses.map((a) => [a.key, a.components])) } : null;
  return { streams, initial, previous: prev };
}
