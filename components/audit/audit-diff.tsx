import { eventDiff } from "./diff";
import { fieldLabel, isIdentifier, valueLabel } from "./labels";

/**
 * One event's before → after: changed fields in full with their names and values in words,
 * unchanged ones counted. Identifiers the trail keeps for machines (record ids) are left out: the
 * record column names the record.
 */
export function AuditDiff({ before, after }: { before: unknown; after: unknown }) {
  const raw = eventDiff(before, after);
  const d = {
    ...raw,
    rows: raw.rows
      .filter((r) => !isIdentifier(r.before) && !isIdentifier(r.after))
      .map((r) => ({ ...r, label: fieldLabel(r.field), before: r.before === null ? null : valueLabel(r.field, r.before), after: r.after === null ? null : valueLabel(r.field, r.after) })),
    context: raw.context.filter((c) => !isIdentifier(c.value)).map((c) => ({ ...c, label: fieldLabel(c.field), value: valueLabel(c.field, c.value) })),
  };
  if (d.rows.length === 0 && d.context.length === 0) return <span className="text-ink-faint">no values recorded</span>;
  return (
    <div className="space-y-1">
      {d.context.length ? (
        <p className="text-xs text-ink-soft">
          {d.context.map((c) => (
            <span key={c.field} className="mr-2">
              {c.label} <span className="num text-ink">{c.value}</span>
            </span>
          ))}
        </p>
      ) : null}
      {d.rows.length ? (
        <dl className="grid grid-cols-[max-content_1fr] gap-x-3 gap-y-0.5 text-xs">
          {d.rows.map((r) => (
            <div key={r.field} className="contents">
              <dt className="text-ink-soft">{r.label}</dt>
              <dd className="num break-all">
                {r.change === "added" ? (
                  <>
                    <span className="sr-only">set to </span>
                    <span className="font-medium text-ink">{r.after}</span>
                  </>
                ) : (
                  <>
                    <span className="sr-only">from </span>
                    <del className="text-ink-soft decoration-ink-faint">{r.before}</del>
                    <span aria-hidden="true" className="px-1 text-ink-faint">
                      →
                    </span>
                    <span className="sr-only"> to </span>
                    {r.change === "removed" ? <span className="text-fault">removed</span> : <ins className="font-medium text-ink no-underline">{r.after}</ins>}
                  </>
                )}
              </dd>
            </div>
          ))}
        </dl>
      ) : null}
      {d.unchanged ? <p className="text-xs text-ink-faint">{d.unchanged} unchanged field{d.unchanged === 1 ? "" : "s"}</p> : null}
    </div>
  );
}
