import { useQuery } from '@tanstack/react-query';
import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { meQueryOptions } from '../../features/auth/api/session';

/** The signed-in part of the site. The loader checks the session on navigation; this covers a sign-out in place. */
export function RequireSessionRoute() {
  const { data: me } = useQuery(meQueryOptions());
  const location = useLocation();
  if (!me) {
    const next = location.pathname + location.search;
    return <Navigate to={next === '/' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(next)}`} replace />;
  }
  return <Outlet />;
}
