import { useQuery } from '@tanstack/react-query';
import { Link, Outlet, useLocation, useNavigate, useNavigation } from 'react-router-dom';
import { canEditProjects, canManageMembers } from '../../../shared/contracts';
import { AppShell, type NavItem } from '../../components/layouts/app-shell';
import { BrandMark } from '../../components/layouts/brand-mark';
import { Badge } from '../../components/ui/badge';
import { Button, buttonClass } from '../../components/ui/button';
import { Loading } from '../../components/ui/loading';
import { appConfigQueryOptions, meQueryOptions, useSignOut } from '../../features/auth/api/session';
import { UnitSystemSwitch, useUnitSystemPreference } from '../../features/preferences/components/unit-system-switch';
import { UnitSystemProvider } from '../../lib/display-units';
import { formatRole } from '../../lib/format';

/** The frame of every page: header with the navigation that fits the signed-in role, the page, the footer. */
export function RootLayoutRoute() {
  const { data: me } = useQuery(meQueryOptions());
  const { data: config } = useQuery(appConfigQueryOptions());
  const signOut = useSignOut();
  const navigate = useNavigate();
  const location = useLocation();
  const navigation = useNavigation();
  const unitSystem = useUnitSystemPreference(Boolean(me));

  const nav: NavItem[] = [];
  if (me) {
    nav.push({ to: '/projects', label: 'Projects' });
    if (canManageMembers(me.role)) nav.push({ to: '/members', label: 'Members' });
  }
  // The server opens the mailbox to the demo organisation's admin only (it holds live invitation links).
  if (config?.devMailbox && me?.role === 'admin') nav.push({ to: '/dev/mail', label: 'Dev mailbox' });
  nav.push({ to: '/about', label: 'About' });

  const account = me ? (
    <>
      <div className="flex min-w-0 flex-col items-end gap-0.5 leading-tight">
        <span className="flex items-center gap-2 text-small font-semibold text-ink">
          {me.name}
          <Badge tone={canEditProjects(me.role) ? 'tide' : 'neutral'}>{formatRole(me.role)}</Badge>
        </span>
        <span className="max-w-[min(24rem,100%)] truncate text-caption text-ink-muted" title={me.organisation.name}>
          {me.organisation.name}
        </span>
      </div>
      <UnitSystemSwitch />
      <Button
        tone="secondary"
        busy={signOut.isPending}
        onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate('/sign-in', { replace: true }) })}
      >
        Sign out
      </Button>
    </>
  ) : location.pathname === '/sign-in' ? null : (
    <Link to="/sign-in" className={buttonClass('secondary')}>
      Sign in
    </Link>
  );

  return (
    <AppShell nav={nav} account={account}>
      {navigation.state !== 'idle' ? (
        <div role="progressbar" aria-label="Loading the next page" className="fixed inset-x-0 top-0 z-40 h-1.5 overflow-hidden">
          <div className="h-full w-1/3 animate-pulse bg-ember-500" />
        </div>
      ) : null}
      {signOut.isError ? <p role="alert" className="mb-4 text-small text-signal-error">Sign-out failed. Try again.</p> : null}
      <UnitSystemProvider value={unitSystem}>
        <Outlet />
      </UnitSystemProvider>
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
