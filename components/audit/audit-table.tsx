import { formatDateTime } from "@/reports/format";
import type { AuditTrailRow } from "@/db/queries/audit-trail";
import { AuditDiff } from "./audit-diff";
import { actionLabel, channelLabel, entityLabel } from "./labels";

/** The events of one page; each row reads as who, when, through what, which record, what changed. */
export function AuditTable({ events, records }: { events: AuditTrailRow[]; records: Map<number, string> }) {
  return (
    <div className="relative overflow-x-auto border border-rule bg-white" role="region" aria-label="Audit events" tabIndex={0}>
      <table className="w-full text-left text-sm">
        <thead className="border-b border-rule bg-paper-deep text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th scope="col" className="px-3 py-2 font-medium">When</th>
            <th scope="col" className="px-3 py-2 font-medium">Who</th>
            <th scope="col" className="px-3 py-2 font-medium">Record</th>
            <th scope="col" className="px-3 py-2 font-medium">Before → after</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-rule">
          {events.map((e) => (
            <tr key={e.id} className="align-top">
              <td className="num px-3 py-2 whitespace-nowrap text-ink-soft">{formatDateTime(e.at)}</td>
              <td className="px-3 py-2">
                <div>{e.actorLabel}</div>
                <div className="text-xs text-ink-soft">{channelLabel(e.channel)}</div>
              </td>
              <td className="px-3 py-2">
                <div>
                  {entityLabel(e.entity)}: <span className="text-ink-soft">{actionLabel(e.action)}</span>
                </div>
                {records.get(e.id) ? <div className="text-xs text-ink-soft">{records.get(e.id)}</div> : e.siteName ? <div className="text-xs text-ink-soft">{e.siteName}</div> : null}
                {e.reason ? <div className="mt-0.5 text-xs">Reason: {e.reason}</div> : null}
              </td>
              <td className="min-w-64 px-3 py-2">
                <AuditDiff before={e.before} after={e.after} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
