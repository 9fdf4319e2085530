/** Placeholders while a widget computes: the shape of what comes, announced as busy. */
export function CardSkeleton({ title }: { title: string }) {
  return (
    <section aria-busy="true" aria-label={`${title}: loading`} className="border border-rule bg-white px-4 py-3">
      <p className="font-semibold">{title}</p>
      <p className="mt-1 text-sm text-ink-soft">Computing the year from the stored months…</p>
      <div className="mt-3 grid gap-2 sm:grid-cols-3" aria-hidden="true">
        {[0, 1, 2, 3, 4, 5].map((i) => (
          <div key={i} className="h-10 animate-pulse bg-paper-deep" />
        ))}
      </div>
    </section>
  );
}

export function ListSkeleton({ label }: { label: string }) {
  return (
    <div aria-busy="true" aria-label={`${label}: loading`} className="space-y-1.5 border border-rule bg-white px-4 py-3">
      {[0, 1, 2].map((i) => (
        <div key={i} aria-hidden="true" className="h-5 animate-pulse bg-paper-deep" />
      ))}
    </div>
  );
}
