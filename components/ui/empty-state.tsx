import type { ReactNode } from "react";

/**
 * A section that has nothing to show yet. It always says what will appear here and, where
 * someone can change that, who and how, so an empty screen is never a dead end.
 */
export function EmptyState({ title, children, action }: { title: string; children: ReactNode; action?: ReactNode }) {
  return (
    <section className="border border-dashed border-rule-strong bg-paper px-5 py-6">
      <h2 className="text-base font-semibold">{title}</h2>
      <div className="mt-1.5 max-w-prose space-y-2 text-ink-soft">{children}</div>
      {action ? <div className="mt-4">{action}</div> : null}
    </section>
  );
}
