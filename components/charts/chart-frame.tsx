"use client";

import type { ReactNode } from "react";
import { fixed, signed } from "@/reports/format";
import type { ChartRow } from "./chart-data";

/** Palette of the charts: ink, the one accent, and a warm brown; series also differ by dash. */
export const INK = "#15233d";
export const ACCENT = "#1c6d64";
export const BROWN = "#7d4f00";
export const SOFT = "#5f6677";
export const RULE = "#d9d5c9";

export const axisProps = { stroke: SOFT, tick: { fill: "#46526a", fontSize: 11 }, tickLine: false } as const;

/** A chart with its title, unit and a sentence saying what the lines are, read before the picture. */
export function ChartFrame({ id, title, unit, note, children }: { id: string; title: string; unit: string; note?: ReactNode; children: ReactNode }) {
  return (
    <figure aria-labelledby={`${id}-title`} className="border border-rule bg-white px-3 pb-2 pt-2.5" data-chart={id}>
      <figcaption id={`${id}-title`} className="flex flex-wrap items-baseline justify-between gap-x-2">
        <span className="font-semibold">{title}</span>
        <span className="text-xs text-ink-soft">{unit}</span>
      </figcaption>
      {note ? <p className="text-xs text-ink-soft">{note}</p> : null}
      {/* The picture is described by the title and the note above; the table view holds the figures. */}
      <div className="mt-1 h-[220px] w-full" role="img" aria-label={`${title}, ${unit}${typeof note === "string" ? `. ${note}` : ""}`}>
        {children}
      </div>
    </figure>
  );
}

export interface SeriesKey {
  key: keyof ChartRow["text"];
  name: string;
  unit: string;
  places: number;
  sign?: boolean;
}

/** Tooltip listing each series' exact figure (rounded for reading) with its unit and the month's state. */
export function FigureTooltip({ active, payload, keys }: { active?: boolean; payload?: readonly { payload?: unknown }[]; keys: SeriesKey[] }) {
  const row = payload?.[0]?.payload as ChartRow | undefined;
  if (!active || !row) return null;
  return (
    <div className="border border-rule-strong bg-white px-2.5 py-1.5 text-xs shadow-sm">
      <p className="font-semibold">
        {row.month} <span className="font-normal text-ink-soft">{row.state ? row.state.replace("_", " ") : "not started"}</span>
      </p>
      {keys.map((k) => (
        <p key={k.key} className="num">
          <span className="font-sans text-ink-soft">{k.name}: </span>
          {k.sign ? signed(row.text[k.key], k.places) : fixed(row.text[k.key], k.places)} <span className="font-sans text-ink-soft">{k.unit}</span>
        </p>
      ))}
    </div>
  );
}
