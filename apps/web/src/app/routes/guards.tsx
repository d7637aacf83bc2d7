import type { ReactNode } from 'react';
import { Navigate, Outlet, useLocation } from 'react-router';
import type { Permission } from '@lotwise/shared';
import { ErrorState } from '../../components/ui/error-state';
import { PageSpinner } from '../../components/ui/spinner';
import { useCan, useCurrentUser } from '../../lib/auth';
import { paths } from '../../config/paths';
import { AppShell } from '../layout/app-shell';
import { ForbiddenPage } from './status-pages';

/** The signed-in part of Lotwise; anyone else is sent to sign-in and brought back after. */
export function SignedInLayout() {
  const me = useCurrentUser();
  const location = useLocation();

  if (me.isPending) return <PageSpinner label="Opening Lotwise…" />;
  if (me.isError) {
    return (
      <div className="mx-auto max-w-xl p-8">
        <ErrorState
          title="Lotwise could not check who is signed in"
          error={me.error}
          onRetry={() => void me.refetch()}
        />
      </div>
    );
  }
  if (!me.data) {
    const next = `${location.pathname}${location.search}`;
    const to = next === '/' ? paths.signIn : `${paths.signIn}?next=${encodeURIComponent(next)}`;
    return <Navigate to={to} replace />;
  }
  return <AppShell user={me.data} />;
}

/** Shows the page (or, without children, the nested routes) only to roles holding the permission. */
export function RequirePermission({
  permission,
  children,
}: {
  permission: Permission;
  children?: ReactNode;
}) {
  const allowed = useCan(permission);
  if (!allowed) return <ForbiddenPage />;
  return children ?? <Outlet />;
}
