import { link } from "@/components/ui/styles";
import type { StatementSummary } from "@/db/queries/statements";
import { STATE_LABELS, type MonthState } from "@/lib/month-states";
import { utcStamp } from "@/reports/format";

export interface HistoryItem {
  id: number;
  transition: string;
  actorLabel: string;
  at: Date;
  reason: string | null;
  fromState: string | null;
  toState: string | null;
  revision: number | null;
  details: Record<string, unknown>;
}

const stateLabel = (s: string | null) => (s && s in STATE_LABELS ? STATE_LABELS[s as MonthState] : (s ?? "—"));

/** Every state change of the month, newest first, as the audit trail recorded it. */
export function HistoryList({ items }: { items: HistoryItem[] }) {
  if (items.length === 0) return <p className="text-sm text-ink-soft">No state changes yet: the month has been Open since its figures arrived.</p>;
  return (
    <ol className="space-y-2 text-sm">
      {[...items].reverse().map((e) => (
        <li key={e.id} className="border-l-2 border-rule-strong pl-3">
          <p>
            {e.transition === "method-changed" ? (
              <span className="font-medium">
                Method set to {String(e.details.emissions)}, {String(e.details.factor_set)}, {String(e.details.gwp)}
              </span>
            ) : (
              <>
                <span className="font-medium">{stateLabel(e.fromState)}</span> → <span className="font-medium">{stateLabel(e.toState)}</span>
              </>
            )}{" "}
            <span className="text-ink-soft">
              by {e.actorLabel}, <span className="num">{utcStamp(e.at)}</span>
              {e.revision ? <>, revision {e.revision}</> : null}
            </span>
          </p>
          {e.reason ? <p className="text-ink-soft">&ldquo;{e.reason}&rdquo;</p> : null}
          {typeof e.details.reference === "string" ? (
            <p className="text-ink-soft">
              Authority reference <span className="num">{e.details.reference}</span>, submitted {String(e.details.submittedOn)}
            </p>
          ) : null}
          {typeof e.details.sha256 === "string" ? <p className="num break-all text-xs text-ink-faint">SHA-256 {e.details.sha256}</p> : null}
          {e.details.snapshot && typeof e.details.snapshot === "object" ? (
            <p className="num break-all text-xs text-ink-faint">Frozen: document SHA-256 {String((e.details.snapshot as { documentSha256?: string }).documentSha256)}</p>
          ) : null}
        </li>
      ))}
    </ol>
  );
}

/** The signed PDF of every revision; earlier revisions stay downloadable after a reopen. */
export function SignedPdfList({ statements }: { statements: StatementSummary[] }) {
  if (statements.length === 0) return <p className="text-sm text-ink-soft">No revision of this month has been signed yet.</p>;
  return (
    <ul className="space-y-2 text-sm">
      {statements.map((s) => (
        <li key={s.id} className="flex flex-wrap items-baseline justify-between gap-2 border border-rule bg-paper px-3 py-2">
          <span>
            Revision <span className="num">{s.revision}</span>, signed by {s.signerName} on <span className="num">{utcStamp(s.signedAt)}</span>
            <span className="num block break-all text-xs text-ink-faint">SHA-256 {s.sha256}</span>
          </span>
          <a className={link} href={`/api/v1/statements/${s.id}/pdf`} download>
            Download PDF (rev. {s.revision})
          </a>
        </li>
      ))}
    </ul>
  );
}
