import Link from "next/link";
import { buttonPrimary, buttonSecondary, input, label, link } from "@/components/ui/styles";
import { CHANNELS, auditQuery, type AuditFilterInput } from "@/lib/api/audit-filter";
import { entityLabel } from "./labels";

interface Props {
  values: Partial<Record<"site" | "entity" | "channel" | "actor" | "from" | "to", string>>;
  sites: { id: string; name: string; archived: boolean }[];
  entities: string[];
  /** The valid filter, for the CSV link; absent while the form holds an error. */
  filter?: AuditFilterInput;
}

const field = "min-w-0";
const control = `mt-1 ${input} py-1 text-sm`;

/** A plain GET form: the filters live in the URL, so a filtered view can be bookmarked or sent to a verifier. */
export function AuditFilters({ values, sites, entities, filter }: Props) {
  return (
    <form method="get" action="/audit" className="border border-rule bg-white px-4 py-3" aria-label="Filter the audit trail">
      <div className="grid grid-cols-1 gap-3 min-[420px]:grid-cols-2 sm:grid-cols-3 lg:grid-cols-6">
        <div className={field}>
          <label htmlFor="f-site" className={label}>Site</label>
          <select id="f-site" name="site" defaultValue={values.site ?? ""} className={control}>
            <option value="">All sites</option>
            {sites.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
                {s.archived ? " (archived)" : ""}
              </option>
            ))}
          </select>
        </div>
        <div className={field}>
          <label htmlFor="f-entity" className={label}>Record</label>
          <select id="f-entity" name="entity" defaultValue={values.entity ?? ""} className={control}>
            <option value="">All records</option>
            {entities.map((e) => (
              <option key={e} value={e}>
                {entityLabel(e)}
              </option>
            ))}
          </select>
        </div>
        <div className={field}>
          <label htmlFor="f-channel" className={label}>Channel</label>
          <select id="f-channel" name="channel" defaultValue={values.channel ?? ""} className={control}>
            <option value="">All channels</option>
            {CHANNELS.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </select>
        </div>
        <div className={field}>
          <label htmlFor="f-actor" className={label}>Who</label>
          <input id="f-actor" name="actor" defaultValue={values.actor ?? ""} placeholder="name or token label" className={control} />
        </div>
        <div className={field}>
          <label htmlFor="f-from" className={label}>From</label>
          <input id="f-from" name="from" type="date" defaultValue={values.from ?? ""} className={control} />
        </div>
        <div className={field}>
          <label htmlFor="f-to" className={label}>To (inclusive)</label>
          <input id="f-to" name="to" type="date" defaultValue={values.to ?? ""} className={control} />
        </div>
      </div>
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <button type="submit" className={buttonPrimary}>
          Apply filters
        </button>
        <Link href="/audit" className={buttonSecondary}>
          Clear
        </Link>
        {filter ? (
          <a href={`/api/v1/audit/export${auditQuery(filter)}`} className={`${link} text-sm`} download>
            Download these events as CSV
          </a>
        ) : null}
        <span className="text-xs text-ink-soft">Dates are UTC days.</span>
      </div>
    </form>
  );
}
