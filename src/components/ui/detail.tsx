import type { ReactNode } from 'react';

/** One term and its value in a details list (`<dl>`). */
export function Detail({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-0.5">
      <dt className="text-caption font-semibold uppercase tracking-[0.08em] text-ink-muted">{term}</dt>
      <dd className="text-body text-ink">{children}</dd>
    </div>
  );
}
