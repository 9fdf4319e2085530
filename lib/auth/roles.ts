/** Roles, their labels in the product, and what each may do (BRIEF.md, "Who uses it"). */
export const ROLES = [
  "administrator",
  "process_engineer",
  "environmental_officer",
  "signatory",
  "auditor",
] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  administrator: "Administrator",
  process_engineer: "Process engineer",
  environmental_officer: "Environmental officer",
  signatory: "Signatory",
  auditor: "Auditor",
};

/** Capabilities checked by server code; a role grants the capabilities listed for it. */
export const PERMISSIONS = {
  "org:read": ROLES,
  "org:manage-users": ["administrator"],
  "site:manage": ["administrator"],
  "month:enter": ["process_engineer"],
  "month:balance": ["process_engineer"],
  "month:prepare": ["environmental_officer"],
  /** Writing the explanation of a flag the engine raised (while the month is Open or Balanced). */
  "month:explain": ["process_engineer", "environmental_officer"],
  /** Choosing a month's emissions method, factor set and GWP set (while Open or Balanced). */
  "month:method": ["environmental_officer", "administrator"],
  "month:sign": ["signatory"],
  "audit:read": ROLES,
} as const satisfies Record<string, readonly Role[]>;
export type Permission = keyof typeof PERMISSIONS;

export function rolesGrant(roles: readonly Role[], permission: Permission): boolean {
  const allowed: readonly Role[] = PERMISSIONS[permission];
  return roles.some((r) => allowed.includes(r));
}

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}
