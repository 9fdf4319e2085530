import type { ReactNode } from "react";
import { CheckIcon, FaultIcon, InfoIcon, LockIcon, PendingIcon, WarnIcon } from "./icons";

export type StatusTone = "ok" | "warn" | "fault" | "info" | "pending" | "locked";

const TONES: Record<StatusTone, { icon: typeof CheckIcon; className: string }> = {
  ok: { icon: CheckIcon, className: "text-accent-strong" },
  warn: { icon: WarnIcon, className: "text-warn" },
  fault: { icon: FaultIcon, className: "text-fault" },
  info: { icon: InfoIcon, className: "text-ink-soft" },
  pending: { icon: PendingIcon, className: "text-ink-soft" },
  locked: { icon: LockIcon, className: "text-ink" },
};

/** A state shown as icon plus word: colour only reinforces it, so it survives print and colour blindness. */
export function Status({ tone, children }: { tone: StatusTone; children: ReactNode }) {
  const { icon: Icon, className } = TONES[tone];
  return (
    <span className={`inline-flex items-center gap-1.5 font-medium ${className}`}>
      <Icon className="size-[1.05em] shrink-0" />
      <span>{children}</span>
    </span>
  );
}

/** A page-level message box; `role` makes screen readers announce errors when they appear. */
export function Notice({ tone, title, children }: { tone: StatusTone; title?: string; children?: ReactNode }) {
  const { icon: Icon, className } = TONES[tone];
  const wash = tone === "fault" ? "bg-fault-wash border-fault/40" : tone === "warn" ? "bg-warn-wash border-warn/40" : tone === "ok" ? "bg-accent-wash border-accent/40" : "bg-paper-deep border-rule";
  return (
    <div role={tone === "fault" || tone === "warn" ? "alert" : "status"} className={`flex gap-2.5 border px-3 py-2.5 ${wash}`}>
      <Icon className={`mt-0.5 size-4 shrink-0 ${className}`} />
      <div className="min-w-0">
        {title ? <p className={`font-semibold ${className}`}>{title}</p> : null}
        {children ? <div className="text-ink">{children}</div> : null}
      </div>
    </div>
  );
}
