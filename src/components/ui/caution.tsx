import type { ReactNode } from 'react';

/**
 * The engineering caution on a page that shows computed results or published limits. `wording` replaces the standard
 * words where a document carries its own caution (the hardware sheet's, word for word as its files have it).
 */
export function Caution({ children, wording }: { children?: ReactNode; wording?: string }) {
  return (
    <aside aria-label="Caution" className="rounded-plate border-l-4 border-ember-500 bg-ember-50 px-4 py-3 text-small text-ink">
      <strong className="font-semibold text-ember-700">Caution. </strong>
      {wording ?? (
        <>
          These results support, and never replace, the judgement of a qualified engineer, who remains responsible for the
          design. Load models and limits are those of the guide named beside each; local codes, the project&apos;s
          specification and licensed practice govern.
        </>
      )}
      {children ? <> {children}</> : null}
    </aside>
  );
}
