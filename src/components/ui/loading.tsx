/** A quiet placeholder while data is on its way; screen readers hear the label once. */
export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" aria-live="polite" className="flex items-center gap-3 py-8 text-small text-ink-muted">
      <span aria-hidden="true" className="size-4 animate-spin rounded-full border-2 border-tide-600 border-r-transparent" />
      {label}
    </div>
  );
}
