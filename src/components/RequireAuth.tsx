import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router';
import { useMe } from '../api/auth';
import type { Me } from '../api/types';
import { Loading, LoadError } from './LoadState';

/** Renders its children with the signed-in user, or sends the visitor to /signin. */
export function RequireAuth({ children }: { children: (me: Me) => ReactNode }) {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <Loading what="your account" />;
  if (me.isError) return <LoadError error={me.error} what="account" onRetry={() => void me.refetch()} />;
  if (!me.data) {
    const from = location.pathname + location.search;
    return <Navigate to="/signin" replace state={{ from }} />;
  }
  return <>{children(me.data)}</>;
}
