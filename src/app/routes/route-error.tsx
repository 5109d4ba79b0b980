import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { BrandMark } from '../../components/layouts/brand-mark';
import { SiteFooter } from '../../components/layouts/site-footer';
import { buttonClass } from '../../components/ui/button';
import { describeError } from '../../lib/api-client';

function errorText(error: unknown): { title: string; detail: string } {
  if (isRouteErrorResponse(error)) {
    return error.status === 404
      ? { title: 'Page not found', detail: 'There is no page at this address.' }
      : { title: `The page could not be shown (${error.status})`, detail: error.statusText };
  }
  return { title: 'This part of the page failed', detail: describeError(error) };
}

/** Error boundary of one section of the site: the rest of the page (header, navigation) keeps working. */
export function RouteError() {
  const error = useRouteError();
  const { title, detail } = errorText(error);
  return (
    <div role="alert" className="rounded-plate border border-signal-error/40 bg-signal-error-bg p-6">
      <h1 className="text-title font-semibold text-signal-error">{title}</h1>
      <p className="mt-2 text-body text-ink-soft">{detail}</p>
      <div className="mt-4 flex gap-3">
        <button type="button" className={buttonClass('secondary')} onClick={() => window.location.reload()}>
          Reload the page
        </button>
        <Link to="/projects" className={buttonClass('quiet')}>
          Go to projects
        </Link>
      </div>
    </div>
  );
}

/** Last-resort boundary when even the frame of the site fails (for example the server cannot be reached). */
export function RootErrorRoute() {
  const error = useRouteError();
  const { title, detail } = errorText(error);
  return (
    <div className="flex min-h-screen flex-col">
      <main className="mx-auto flex w-full max-w-xl flex-1 flex-col justify-center gap-4 px-6 py-16">
        <div className="flex items-center gap-2 text-tide-800">
          <BrandMark />
          <span className="text-lead font-bold">Stillspan</span>
        </div>
        <div role="alert">
          <h1 className="text-headline font-semibold text-ink">{title}</h1>
          <p className="mt-2 text-body text-ink-soft">{detail}</p>
        </div>
        <div>
          <button type="button" className={buttonClass('primary')} onClick={() => window.location.reload()}>
            Try again
          </button>
        </div>
      </main>
      <SiteFooter />
    </div>
  );
}
