import { useQuery } from '@tanstack/react-query';
import { Link, Outlet, useNavigate } from 'react-router-dom';
import { canEditProjects } from '../../../shared/contracts';
import { AppShell, type NavItem } from '../../components/layouts/app-shell';
import { BrandMark } from '../../components/layouts/brand-mark';
import { Badge } from '../../components/ui/badge';
import { Button, buttonClass } from '../../components/ui/button';
import { Loading } from '../../components/ui/loading';
import { appConfigQueryOptions, meQueryOptions, useSignOut } from '../../features/auth/api/session';
import { formatRole } from '../../lib/format';

/** The frame of every page: header with the navigation that fits the signed-in role, the page, the footer. */
export function RootLayoutRoute() {
  const { data: me } = useQuery(meQueryOptions());
  const { data: config } = useQuery(appConfigQueryOptions());
  const signOut = useSignOut();
  const navigate = useNavigate();

  const nav: NavItem[] = [];
  if (me) {
    nav.push({ to: '/projects', label: 'Projects' });
    if (me.role === 'admin') nav.push({ to: '/members', label: 'Members' });
  }
  if (config?.devMailbox) nav.push({ to: '/dev/mail', label: 'Dev mailbox' });
  nav.push({ to: '/about', label: 'About' });

  const account = me ? (
    <>
      <div className="flex flex-col items-end leading-tight">
        <span className="text-small font-semibold text-ink">{me.name}</span>
        <span className="flex items-center gap-1.5 text-caption text-ink-muted">
          <Badge tone={canEditProjects(me.role) ? 'tide' : 'neutral'}>{formatRole(me.role)}</Badge>
          {me.organisation.name}
        </span>
      </div>
      <Button
        tone="secondary"
        busy={signOut.isPending}
        onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate('/sign-in', { replace: true }) })}
      >
        Sign out
      </Button>
    </>
  ) : (
    <Link to="/sign-in" className={buttonClass('secondary')}>
      Sign in
    </Link>
  );

  return (
    <AppShell nav={nav} account={account}>
      {signOut.isError ? <p role="alert" className="mb-4 text-small text-signal-error">Sign-out failed. Try again.</p> : null}
      <Outlet />
    </AppShell>
  );
}

/** Shown while the first page load asks the server who is signed in. */
export function RootLoading() {
  return (
    <div className="flex min-h-screen flex-col items-center justify-center gap-4 text-tide-800">
      <BrandMark className="size-12" />
      <Loading label="Opening Stillspan…" />
    </div>
  );
}
