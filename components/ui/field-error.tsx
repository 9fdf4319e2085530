import { FaultIcon } from "./icons";

/** The message under a field; its id is what the input's aria-describedby points at. */
export function FieldError({ id, message }: { id: string; message?: string }) {
  if (!message) return null;
  return (
    <p id={id} className="mt-1 flex items-start gap-1 text-sm text-fault">
      <FaultIcon className="mt-0.5 size-3.5 shrink-0" />
      <span>{message}</span>
    </p>
  );
}
