/**
 * The audit trail in the pages' words: record kinds, actions, channels and recorded values as
 * people read them. The trail itself keeps the codes (and the CSV export carries them), so
 * nothing is lost; this only decides what is shown.
 */
import { STATE_LABELS, type MonthState } from "@/lib/month-states";
import { fixed, signed } from "@/reports/format";
import { UUID } from "@/db/queries/uuid";

const ENTITY_LABELS: Record<string, string> = {
  reading: "Reading",
  analysis: "Gas analysis",
  month: "Month",
  site: "Site",
  stream: "Stream",
  statement: "Statement",
  membership: "Membership",
  invitation: "Invitation",
  api_token: "API token",
  import: "Import",
  import_batch: "Import",
  attachment: "Attachment",
  signing_certificate: "Signing certificate",
  user: "Account",
};

export function entityLabel(entity: string): string {
  return ENTITY_LABELS[entity] ?? entity.replace(/[_-]/g, " ");
}

const ACTION_LABELS: Record<string, string> = {
  "reading.added": "figure entered",
  "reading.changed": "figure changed",
  "reading.removed": "figure removed",
  "analysis.added": "analysis entered",
  "analysis.changed": "analysis changed",
  "month.balance": "balance closed",
  "month.send-for-review": "sent for sign-off",
  "month.return": "returned with comments",
  "month.sign": "statement signed",
  "month.record-submission": "submission recorded",
  "month.reopen": "reopened",
  "month.state": "state changed",
  "month.method-changed": "method chosen",
  "flag.explained": "flag explained",
  "months.seeded": "months seeded (demo)",
  "site.created": "set up",
  "site.changed": "settings changed",
  "site.installation-changed": "installation identity changed",
  "site.archived": "archived",
  "site.restored": "restored",
  "stream.created": "added",
  "stream.changed": "definition changed",
  "stream.archived": "archived",
  "stream.restored": "restored",
  "statement.signed": "signed and sealed",
  "member.added": "added",
  "member.roles-changed": "roles changed",
  "member.removed": "removed from the organisation",
  "invitation.created": "sent",
  "invitation.revoked": "revoked",
  "invitation.accepted": "accepted",
  "user.created": "created",
  "user.disabled": "disabled",
  "user.enabled": "enabled",
  "user.password-changed": "password changed",
  "user.signed-out-everywhere": "signed out everywhere",
  "api-token.created": "created",
  "api-token.revoked": "revoked",
  "attachment.uploaded": "attached",
  "attachment.deleted": "deleted",
  "import.committed": "imported",
  "import.replaced": "re-imported over an earlier file",
  "certificate.added": "added",
  "certificate.activated": "made active",
};

/** "month.send-for-review" → "sent for sign-off"; an unknown action in plain words. */
export function actionLabel(action: string): string {
  return ACTION_LABELS[action] ?? action.replace(/^[a-z_-]+\./, "").replace(/[-_]/g, " ");
}

const CHANNEL_LABELS: Record<string, string> = {
  form: "in the app",
  import: "by file import",
  "api-token": "by a plant system (API token)",
  system: "by Synledger itself",
  seed: "by the demo seed",
};

export const channelLabel = (channel: string) => CHANNEL_LABELS[channel] ?? channel;

const FIELD_LABELS: Record<string, string> = {
  quantity: "quantity",
  unit: "unit",
  source: "source",
  note: "note",
  state: "state",
  version: "version",
  revision: "revision",
  period: "month",
  reason: "reason",
  factorSet: "factor set",
  factor_set: "factor set",
  emissions: "emissions method",
  emissionsMethod: "emissions method",
  method: "emissions method",
  gwp: "GWP set",
  closureTolerancePct: "closure tolerance (%)",
  meteringReference: "metering reference",
  sampledOn: "sampled on",
  laboratory: "laboratory",
  carbonUncertaintyPct: "carbon content uncertainty (%)",
  cvUncertaintyPct: "calorific value uncertainty (%)",
  systematicPct: "repeating share of the uncertainty (%)",
  metered: "metered",
  sha256: "SHA-256 of the PDF",
  reference: "authority's reference",
  submittedOn: "submitted on",
  sessionsEnded: "sessions ended",
  flag: "flag",
  explanation: "explanation",
  monthsFollowing: "months following the new defaults",
};

/** `closures.carbon` → "carbon closure (%)"; `components.CH4` → "CH4 (mol %)". */
export function fieldLabel(field: string): string {
  const closure = /^closures\.(\w+)$/.exec(field);
  if (closure) return `${closure[1]} closure (%)`;
  const comp = /^components\.(\w+)$/.exec(field);
  if (comp) return `${comp[1]} (mol %)`;
  const snap = /^snapshot\.(\w+)$/.exec(field);
  if (snap) return `frozen record: ${snap[1].replace(/Sha256$/, " SHA-256").replace(/([a-z])([A-Z])/g, "$1 $2").toLowerCase()}`;
  return FIELD_LABELS[field] ?? field.replace(/([a-z])([A-Z])/g, "$1 $2").replace(/[_.]/g, " ").toLowerCase();
}

const DECIMAL = /^-?\d+\.(\d+)$/;

/** An identifier the trail keeps for machines; the page names the record instead. */
export const isIdentifier = (value: string | null) => value !== null && UUID.test(value);

/**
 * A recorded value as shown: states by their names, closures to 2 decimals, other computed
 * figures to at most 6 decimals (figures people typed have fewer and stay as typed).
 */
export function valueLabel(field: string, value: string): string {
  if (field === "state" && value in STATE_LABELS) return STATE_LABELS[value as MonthState];
  const d = DECIMAL.exec(value);
  if (d && field.startsWith("closures.")) return signed(value, 2);
  if (d && d[1].length > 6) return fixed(value, 6);
  return value;
}
