/**
 * Before → after of one audit event as rows a person can read. Values are shown exactly as
 * recorded (decimal strings stay strings); only structure is flattened (`components.CH4`).
 */
export type Change = "added" | "removed" | "changed";

export interface DiffRow {
  field: string;
  before: string | null;
  after: string | null;
  change: Change;
}

export interface EventDiff {
  rows: DiffRow[];
  /** Fields that say which record this is rather than what changed (stream, version). */
  context: { field: string; value: string }[];
  unchanged: number;
}

/** Recorded beside the change to identify it; listing them as "added" would misread as edits. */
const CONTEXT_FIELDS = new Set(["stream", "version", "site"]);
const HIDDEN_FIELDS = new Set(["monthId"]);

function text(v: unknown): string {
  if (v === null || v === undefined) return "—";
  if (typeof v === "string") return v === "" ? "(empty)" : v;
  if (Array.isArray(v) && v.every((x) => typeof x !== "object" || x === null)) return v.length ? v.map(String).join(", ") : "(none)";
  if (typeof v === "object") return JSON.stringify(v);
  return String(v);
}

function flatten(value: unknown, prefix = "", out = new Map<string, string>()): Map<string, string> {
  if (value === null || value === undefined) return out;
  if (typeof value !== "object" || Array.isArray(value)) {
    out.set(prefix || "value", text(value));
    return out;
  }
  for (const [k, v] of Object.entries(value as Record<string, unknown>)) {
    // A null field holds nothing: setting it reads as an addition, clearing it as a removal.
    if (v === null || v === undefined || (!prefix && HIDDEN_FIELDS.has(k))) continue;
    const key = prefix ? `${prefix}.${k}` : k;
    if (v !== null && typeof v === "object" && !Array.isArray(v)) flatten(v, key, out);
    else out.set(key, text(v));
  }
  return out;
}

export function eventDiff(before: unknown, after: unknown): EventDiff {
  const b = flatten(before);
  const a = flatten(after);
  const context: EventDiff["context"] = [];
  const rows: DiffRow[] = [];
  let unchanged = 0;
  const fields = [...new Set([...b.keys(), ...a.keys()])];
  for (const field of fields) {
    const was = b.get(field) ?? null;
    const now = a.get(field) ?? null;
    // A context field only in `after` (while there is a `before`) names the record; it did not change.
    if (CONTEXT_FIELDS.has(field) && (was === null || was === now) && before !== null && before !== undefined) {
      if (now !== null) context.push({ field, value: now });
      continue;
    }
    if (was === now) {
      unchanged++;
      continue;
    }
    rows.push({ field, before: was, after: now, change: was === null ? "added" : now === null ? "removed" : "changed" });
  }
  return { rows, context, unchanged };
}
