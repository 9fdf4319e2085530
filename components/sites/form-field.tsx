import type { ReactNode } from "react";
import { FieldError } from "@/components/ui/field-error";
import { label as labelClass } from "@/components/ui/styles";

/**
 * Label, control, hint and error of one field. The control gets `id`, and must set
 * aria-describedby to `${id}-error` when invalid so the message is read with the field.
 */
export function FormField({ id, label, hint, error, children, className = "" }: { id: string; label: string; hint?: ReactNode; error?: string; children: ReactNode; className?: string }) {
  return (
    <div className={className}>
      <label htmlFor={id} className={labelClass}>
        {label}
      </label>
      <div className="mt-1">{children}</div>
      {hint ? (
        <p id={`${id}-hint`} className="mt-1 text-xs text-ink-soft">
          {hint}
        </p>
      ) : null}
      <FieldError id={`${id}-error`} message={error} />
    </div>
  );
}

/** aria attributes of a control whose error is shown by FormField. */
export function invalidProps(id: string, error?: string) {
  return error ? { "aria-invalid": true as const, "aria-describedby": `${id}-error` } : {};
}
