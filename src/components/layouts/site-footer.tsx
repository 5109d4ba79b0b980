import { Link } from 'react-router-dom';

/** The caution every page carries, in plain words. */
export const engineeringCaution =
  'Stillspan supports the design of a qualified engineer, who remains responsible for it. Its load models and comfort ' +
  "limits are those of the guide named beside each result. Local codes, the project's specification and licensed " +
  'practice govern.';

export function SiteFooter() {
  return (
    <footer className="mt-16 border-t border-paper-line bg-paper-sunk">
      <div className="mx-auto flex max-w-sheet flex-col gap-4 px-5 py-8 sm:flex-row sm:items-start sm:justify-between sm:px-8">
        <p className="max-w-3xl text-small text-ink-soft">
          <strong className="font-semibold text-ember-700">Caution. </strong>
          {engineeringCaution}
        </p>
        <nav aria-label="Footer" className="flex shrink-0 gap-4 text-small">
          <Link to="/about" className="font-medium text-tide-800 underline underline-offset-4 hover:text-tide-900">
            About Stillspan
          </Link>
        </nav>
      </div>
    </footer>
  );
}
