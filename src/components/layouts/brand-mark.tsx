/** Stillspan's mark: a shallow span with a mass hanging beneath it, the picture of a damped deck. */
export function BrandMark({ className = 'size-8' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false">
      <path d="M3 12 Q16 4 29 12" fill="none" stroke="currentColor" strokeWidth="3" strokeLinecap="round" />
      <line x1="16" y1="8" x2="16" y2="19" stroke="currentColor" strokeWidth="2" />
      <path d="M13 16.5 l6 0" stroke="currentColor" strokeWidth="1.5" />
      <rect x="11" y="19" width="10" height="8" rx="1.5" className="fill-ember-500" />
    </svg>
  );
}
