import type { ReactNode } from 'react';

/** A plot in a box of the given height class, with its description written out beneath it. */
export function ChartFigure({ description, heightClass = 'h-72', children }: { description: string; heightClass?: string; children: ReactNode }) {
  return (
    <figure className="flex flex-col gap-2">
      <div className={`relative ${heightClass} w-full`}>{children}</div>
      <figcaption className="text-caption text-ink-muted">{description}</figcaption>
    </figure>
  );
}
