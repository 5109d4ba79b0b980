import { Link } from 'react-router-dom';
import { buttonClass } from '../../components/ui/button';
import { PageTitle } from '../../components/ui/page-title';

export function NotFoundRoute() {
  return (
    <div className="flex flex-col items-start gap-4 py-8">
      <PageTitle title="Page not found" />
      <p className="text-caption font-semibold uppercase tracking-[0.12em] text-ember-600">Error 404</p>
      <h1 className="text-headline font-semibold text-ink">Page not found</h1>
      <p className="max-w-prose text-body text-ink-soft">There is no page at this address. The link may be mistyped or out of date.</p>
      <Link to="/" className={buttonClass('secondary')}>
        Go to the start page
      </Link>
    </div>
  );
}
