import { ROLES, ROLE_LABELS, type Role } from "@/lib/auth/roles";

/** A group of role checkboxes named "roles"; the legend names whose roles they are for screen readers. */
export function RoleCheckboxes({
  idPrefix,
  legend,
  defaultRoles = [],
  invalid,
  describedBy,
  hideLegend = false,
}: {
  idPrefix: string;
  legend: string;
  defaultRoles?: readonly Role[];
  invalid?: boolean;
  describedBy?: string;
  hideLegend?: boolean;
}) {
  return (
    <fieldset aria-invalid={invalid || undefined} aria-describedby={describedBy}>
      <legend className={hideLegend ? "sr-only" : "text-sm font-medium"}>{legend}</legend>
      <div className={`flex flex-wrap gap-x-4 gap-y-1 ${hideLegend ? "" : "mt-1.5"}`}>
        {ROLES.map((role) => (
          <label key={role} htmlFor={`${idPrefix}-${role}`} className="inline-flex items-center gap-1.5 text-sm">
            <input
              id={`${idPrefix}-${role}`}
              type="checkbox"
              name="roles"
              value={role}
              defaultChecked={defaultRoles.includes(role)}
              className="size-3.5 accent-accent"
            />
            {ROLE_LABELS[role]}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
