import { useQuery } from '@tanstack/react-query';
import { Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { appConfigQueryOptions, meQueryOptions } from '../../features/auth/api/session';
import { SignInForm } from '../../features/auth/components/sign-in-form';
import { describeRole, formatRole } from '../../lib/format';
import { safeNextPath } from '../session';
import { PageTitle } from '../../components/ui/page-title';

export function SignInRoute() {
  const { data: me } = useQuery(meQueryOptions());
  const { data: config } = useQuery(appConfigQueryOptions());
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const next = safeNextPath(params.get('next'));

  if (me) return <Navigate to={next} replace />;

  return (
    <div className="grid gap-10 md:grid-cols-[1fr_minmax(0,28rem)] md:items-start">
      <PageTitle title="Sign in" />
      <div className="flex flex-col gap-4 pt-2">
        <p className="text-caption font-semibold uppercase tracking-[0.12em] text-ember-600">Footbridges and long-span floors</p>
        <h1 className="text-display font-semibold text-ink">Keep lively structures calm.</h1>
        <p className="max-w-prose text-lead text-ink-soft">
          Stillspan is where a design team sizes a tuned mass damper: model the mode, check comfort under pedestrian
          load cases, compare tuning variants and hand the fabricator a sheet that can be built and re-tuned on site.
        </p>
        <dl className="mt-4 grid max-w-prose gap-3 border-l-4 border-tide-200 pl-5">
          {(['engineer', 'owner', 'fabricator'] as const).map((role) => (
            <div key={role}>
              <dt className="text-small font-semibold text-ink">{formatRole(role)}</dt>
              <dd className="text-small text-ink-soft">{describeRole(role)}</dd>
            </div>
          ))}
        </dl>
      </div>
      <section aria-labelledby="sign-in-title" className="rounded-plate border border-paper-line bg-paper-raised p-6 shadow-sm sm:p-8">
        <h2 id="sign-in-title" className="mb-6 text-title font-semibold text-ink">
          Sign in
        </h2>
        <SignInForm config={config} onSignedIn={() => navigate(next, { replace: true })} />
      </section>
    </div>
  );
}
