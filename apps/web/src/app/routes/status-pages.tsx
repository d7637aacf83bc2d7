import { Link, isRouteErrorResponse, useRouteError } from 'react-router';
import { FileQuestion, Lock } from 'lucide-react';
import { buttonClasses } from '../../components/ui/button';
import { ErrorState } from '../../components/ui/error-state';
import { paths } from '../../config/paths';

export function NotFoundPage() {
  return (
    <div className="flex max-w-xl flex-col items-start gap-3 py-8">
      <FileQuestion aria-hidden="true" className="size-8 text-ink-400" />
      <h1 className="text-xl font-semibold text-ink-900">Page not found</h1>
      <p className="text-sm text-ink-700">
        There is nothing at this address. It may have been mistyped, or the thing it pointed to has
        been removed.
      </p>
      <Link to={paths.home} className={buttonClasses('secondary')}>
        Go to the start page
      </Link>
    </div>
  );
}

export function ForbiddenPage() {
  return (
    <div className="flex max-w-xl flex-col items-start gap-3 py-8">
      <Lock aria-hidden="true" className="size-8 text-ink-400" />
      <h1 className="text-xl font-semibold text-ink-900">Not available with your role</h1>
      <p className="text-sm text-ink-700">
        Your role does not include this part of Lotwise. If you need it, ask an admin of your lab.
      </p>
      <Link to={paths.home} className={buttonClasses('secondary')}>
        Go to the start page
      </Link>
    </div>
  );
}

/** Last resort when a page fails to render or load its code. */
export function RouteErrorPage() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFoundPage />;
  return (
    <div className="mx-auto max-w-xl p-8">
      <ErrorState
        title="This page failed to open"
        error={error}
        onRetry={() => window.location.reload()}
      />
    </div>
  );
}
