import type { ReactNode } from 'react';

interface PanelProps {
  title?: string;
  description?: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
}

/** A raised sheet holding one piece of a page, titled as a section for assistive technology. */
export function Panel({ title, description, actions, children }: PanelProps) {
  return (
    <section aria-label={title} className="rounded-plate border border-paper-line bg-paper-raised p-5 shadow-[0_1px_0_rgba(27,34,44,0.04)] sm:p-6">
      {title || actions ? (
        <div className="mb-4 flex flex-col gap-2 sm:flex-row sm:items-start sm:justify-between">
          <div>
            {title ? <h2 className="text-lead font-semibold text-ink">{title}</h2> : null}
            {description ? <p className="mt-1 text-small text-ink-muted">{description}</p> : null}
          </div>
          {actions ? <div className="flex shrink-0 gap-2">{actions}</div> : null}
        </div>
      ) : null}
      {children}
    </section>
  );
}
