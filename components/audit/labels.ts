/** Readable names of the record kinds the trail holds; an unknown kind shows as recorded. */
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
};

export function entityLabel(entity: string): string {
  return ENTITY_LABELS[entity] ?? entity;
}
