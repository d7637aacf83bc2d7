import { Navigate, useLocation } from 'react-router';
import { ErrorState } from '../../components/ui/error-state';
import { PageSpinner } from '../../components/ui/spinner';
import { useCurrentUser } from '../../lib/auth';
import { paths } from '../../config/paths';
import { AppShell } from '../layout/app-shell';

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
