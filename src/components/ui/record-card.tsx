import type { ReactNode } from 'react';

interface RecordCardProps {
  name: string;
  badge: ReactNode;
  summary: ReactNode;
  /** Controls at the top right (e.g. a remove control). */
  actions?: ReactNode;
  children?: ReactNode;
}

/** One saved thing in a list: its name with a badge, a one-line summary, controls, then its details. */
export function RecordCard({ name, badge, summary, actions, children }: RecordCardProps) {
  return (
    <li className="flex flex-col gap-3 rounded-plate border border-paper-line bg-paper-raised p-4">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="flex flex-col gap-1">
          <div className="flex flex-wrap items-center gap-2">
            <h3 className="text-body font-semibold text-ink">{name}</h3>
            {badge}
          </div>
          <p className="text-small text-ink-soft">{summary}</p>
        </div>
        {actions}
      </div>
      {children}
    </li>
  );
}
