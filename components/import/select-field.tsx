"use client";

import { useId } from "react";
import { FieldError } from "@/components/ui/field-error";
import { input, label } from "@/components/ui/styles";

export interface Option {
  value: string;
  label: string;
}

/** A labelled select whose error message is tied to it for screen readers. */
export function SelectField({ text, value, options, onChange, error, hint }: { text: string; value: string; options: Option[]; onChange: (v: string) => void; error?: string; hint?: string }) {
  const id = useId();
  const describedBy = [hint ? `${id}-hint` : "", error ? `${id}-err` : ""].filter(Boolean).join(" ") || undefined;
  return (
    <div>
      <label htmlFor={id} className={label}>
        {text}
      </label>
      <select id={id} className={`${input} mt-1`} value={value} onChange={(e) => onChange(e.target.value)} aria-invalid={!!error} aria-describedby={describedBy}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      {hint ? (
        <p id={`${id}-hint`} className="mt-1 text-xs text-ink-soft">
          {hint}
        </p>
      ) : null}
      <FieldError id={`${id}-err`} message={error} />
    </div>
  );
}
