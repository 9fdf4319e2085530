import type { Metadata } from "next";
import { EmptyState } from "@/components/ui/empty-state";
import { formatDateTime } from "@/components/ui/format";
import { pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { listAudit } from "@/db/queries/audit";
import { requirePageActor } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Audit trail" };

const SHOWN = 100;

/** The latest changes of the organisation, newest first. Filters and paging come with the full audit view. */
export default async function AuditPage() {
  const actor = await requirePageActor("audit:read");
  const events = await listAudit(getDb(), actor.organisationId, { limit: SHOWN });
  return (
    <div className="space-y-4">
      <div>
        <h1 className={pageTitle}>Audit trail</h1>
        <p className="mt-1 text-ink-soft">
          Every change, who made it, when and through which channel. Records cannot be edited or deleted. Showing the latest{" "}
          <span className="num">{SHOWN}</span>.
        </p>
      </div>
      {events.length === 0 ? (
        <EmptyState title="No changes recorded yet">
          <p>Changes to figures, balances, statements, users and sites will appear here as they happen, with before and after values.</p>
        </EmptyState>
      ) : (
        <div className="overflow-x-auto border border-rule bg-white">
          <table className="w-full text-left text-sm">
            <thead className="border-b border-rule bg-paper-deep text-xs uppercase tracking-wide text-ink-soft">
              <tr>
                <th scope="col" className="px-3 py-2 font-medium">When</th>
                <th scope="col" className="px-3 py-2 font-medium">Who</th>
                <th scope="col" className="px-3 py-2 font-medium">Channel</th>
                <th scope="col" className="px-3 py-2 font-medium">Change</th>
                <th scope="col" className="px-3 py-2 font-medium">Record</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-rule">
              {events.map((e) => (
                <tr key={e.id} className="align-top">
                  <td className="num px-3 py-1.5 whitespace-nowrap text-ink-soft">{formatDateTime(e.at)}</td>
                  <td className="px-3 py-1.5">{e.actorLabel}</td>
                  <td className="px-3 py-1.5 text-ink-soft">{e.channel}</td>
                  <td className="num px-3 py-1.5">{e.action}</td>
                  <td className="px-3 py-1.5 text-ink-soft">
                    {e.entity}
                    {e.reason ? <span className="block text-xs">Reason: {e.reason}</span> : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
