import { z } from "zod";
import { LIMITS } from "@/lib/balance/limits";
import { typedText } from "./month";

/**
 * The installation a site's statements are issued for, as an authority's case officer reads it:
 * operator, identifiers under each scheme, address, competent authority, monitoring plan and a
 * reporting contact. Saved piece by piece from site settings; complete before a month of the
 * site can be sent for sign-off (missingInstallationFields), frozen with each revision and
 * printed on page 1 of every statement.
 */
export const MAX_IDENTIFIERS = 10;

const field = (label: string, max: number = LIMITS.nameChars) => typedText(label, max);

export const installationIdentifierSchema = z.strictObject({
  scheme: field("scheme", 120).min(1, "Name the scheme the identifier belongs to."),
  identifier: field("identifier", 120).min(1, "Enter the identifier."),
});

export const installationSchema = z.strictObject({
  operatorName: field("operator's legal name"),
  identifiers: z.array(installationIdentifierSchema).max(MAX_IDENTIFIERS, `At most ${MAX_IDENTIFIERS} identifiers.`),
  address: field("address", 500),
  competentAuthority: field("competent authority"),
  monitoringPlanRef: field("monitoring-plan reference", 120),
  monitoringPlanVersion: field("monitoring-plan version", 40),
  contactName: field("reporting contact"),
  contactEmail: z.union([z.literal(""), z.email({ error: "Enter the contact's e-mail address as name@domain." }).max(200)]),
  contactPhone: field("contact telephone", 40),
});

export type InstallationIdentity = z.infer<typeof installationSchema>;
export type InstallationInput = z.input<typeof installationSchema>;

export const EMPTY_INSTALLATION: InstallationIdentity = {
  operatorName: "",
  identifiers: [],
  address: "",
  competentAuthority: "",
  monitoringPlanRef: "",
  monitoringPlanVersion: "",
  contactName: "",
  contactEmail: "",
  contactPhone: "",
};

/** Field → its name in a refusal; the telephone number is the one optional field. */
export const INSTALLATION_FIELD_LABELS: Record<Exclude<keyof InstallationIdentity, "contactPhone">, string> = {
  operatorName: "operator's legal name",
  identifiers: "at least one installation identifier (scheme and identifier)",
  address: "installation address",
  competentAuthority: "competent authority",
  monitoringPlanRef: "monitoring-plan reference",
  monitoringPlanVersion: "monitoring-plan version",
  contactName: "reporting contact's name",
  contactEmail: "reporting contact's e-mail address",
};

/** What is still missing before the site's months may go for sign-off, in form order. */
export function missingInstallationFields(i: InstallationIdentity | null | undefined): { path: string; label: string }[] {
  const v = i ?? EMPTY_INSTALLATION;
  return (Object.keys(INSTALLATION_FIELD_LABELS) as (keyof typeof INSTALLATION_FIELD_LABELS)[])
    .filter((k) => (k === "identifiers" ? v.identifiers.length === 0 : !String(v[k] ?? "").trim()))
    .map((k) => ({ path: `installation.${k}`, label: INSTALLATION_FIELD_LABELS[k] }));
}
