import { FieldError } from "./field-error";
import { input, label } from "./styles";

/** A labelled input with its hint and its error, wired for screen readers (aria-describedby). */
export function TextField(props: {
  id: string;
  labelText: string;
  type?: string;
  autoComplete: string;
  error?: string;
  hint?: string;
  defaultValue?: string;
}) {
  const described = [props.hint ? `${props.id}-hint` : null, props.error ? `${props.id}-error` : null].filter(Boolean).join(" ");
  return (
    <div>
      <label htmlFor={props.id} className={label}>
        {props.labelText}
      </label>
      {props.hint ? (
        <p id={`${props.id}-hint`} className="text-xs text-ink-soft">
          {props.hint}
        </p>
      ) : null}
      <input
        id={props.id}
        name={props.id}
        type={props.type ?? "text"}
        autoComplete={props.autoComplete}
        required
        defaultValue={props.defaultValue}
        aria-invalid={props.error ? true : undefined}
        aria-describedby={described || undefined}
        className={`mt-1 ${input}`}
      />
      <FieldError id={`${props.id}-error`} message={props.error} />
    </div>
  );
}
