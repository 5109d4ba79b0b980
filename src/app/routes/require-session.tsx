import { useQuery } from '@tanstack/react-query';
import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { meQueryOptions } from '../../features/auth/api/session';
import { signInPath } from '../session';

/** The signed-in part of the site. The loader checks the session on navigation; this covers a sign-out in place. */
export function RequireSessionRoute() {
  const { data: me } = useQuery(meQueryOptions());
  const location = useLocation();
  if (!me) return <Navigate to={signInPath(location.pathname + location.search)} replace />;
  return <Outlet />;
}
