import { formatNumber } from '../../../lib/format';

/**
 * A verdict in words and a shape, never by colour alone: a filled square for "meets", an open one with a slash for
 * "exceeds".
 */
export function VerdictTag({ verdict, size = 'normal' }: { verdict: 'pass' | 'fail' | undefined | null; size?: 'normal' | 'small' }) {
  if (!verdict) return <span className="text-ink-muted">no criteria</span>;
  const pass = verdict === 'pass';
  return (
    <span
      className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-plate border px-2 py-0.5 font-semibold ${
        size === 'small' ? 'text-caption' : 'text-small'
      } ${pass ? 'border-tide-200 bg-tide-50 text-tide-800' : 'border-ember-500/60 bg-ember-50 text-ember-700'}`}
    >
      <svg aria-hidden="true" viewBox="0 0 10 10" className="size-2.5">
        {pass ? (
          <rect x="1" y="1" width="8" height="8" fill="currentColor" />
        ) : (
          <>
            <rect x="1" y="1" width="8" height="8" fill="none" stroke="currentColor" strokeWidth="1.6" />
            <line x1="1" y1="9" x2="9" y2="1" stroke="currentColor" strokeWidth="1.6" />
          </>
        )}
      </svg>
      {pass ? 'meets' : 'exceeds'}
    </span>
  );
}

/** A utilisation as a bar against the limit and a percentage. */
export function UtilisationBar({ utilisation }: { utilisation: number | null | undefined }) {
  if (utilisation === null || utilisation === undefined || !Number.isFinite(utilisation)) {
    return <span className="text-ink-muted">—</span>;
  }
  const width = Math.min(utilisation / 1.5, 1) * 100;
  return (
    <span className="inline-flex items-center gap-2 whitespace-nowrap">
      <span className="relative h-2 w-16 shrink-0 overflow-hidden rounded-pill bg-paper-sunk" aria-hidden="true">
        <span className={`absolute inset-y-0 left-0 ${utilisation <= 1 ? 'bg-tide-600' : 'bg-ember-500'}`} style={{ width: `${width}%` }} />
        <span className="absolute inset-y-0 w-px bg-ink" style={{ left: `${100 / 1.5}%` }} />
      </span>
      <span className="tabular-nums">{formatNumber(utilisation * 100, 3)} %</span>
    </span>
  );
}
