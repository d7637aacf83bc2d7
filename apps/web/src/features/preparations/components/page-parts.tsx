import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { ChevronLeft } from 'lucide-react';
import type { UseQueryResult } from '@tanstack/react-query';
import { ErrorState } from '../../../components/ui/error-state';
import { PageSpinner } from '../../../components/ui/spinner';
import { isApiError } from '../../../lib/api-client';

/** A page title with its actions on the right (wrapping under it on narrow screens). */
export function PageHeader({
  title,
  children,
  actions,
  eyebrow,
}: {
  title: ReactNode;
  children?: ReactNode;
  actions?: ReactNode;
  eyebrow?: ReactNode;
}) {
  return (
    <header className="flex flex-wrap items-start justify-between gap-3">
      <div className="max-w-3xl">
        {eyebrow && <div className="text-sm text-ink-600">{eyebrow}</div>}
        <h1 className="text-xl font-semibold text-ink-900">{title}</h1>
        {children && <div className="text-sm text-ink-600">{children}</div>}
      </div>
      {actions && <div className="flex flex-wrap items-center gap-2 print:hidden">{actions}</div>}
    </header>
  );
}

export function BackLink({ to, children }: { to: string; children: ReactNode }) {
  return (
    <Link
      to={to}
      className="inline-flex items-center gap-1 self-start text-sm text-ink-600 hover:text-ink-900 print:hidden"
    >
      <ChevronLeft aria-hidden="true" className="size-4" />
      {children}
    </Link>
  );
}

/** Spinner while loading, a message when missing or failed, else the page. */
export function QueryState<T>({
  query,
  what,
  children,
}: {
  query: UseQueryResult<T>;
  what: string;
  children: (data: T) => ReactNode;
}) {
  if (query.isPending) return <PageSpinner label={`Loading the ${what}…`} />;
  if (query.isError) {
    const missing =
      isApiError(query.error) && (query.error.status === 404 || query.error.status === 400);
    return (
      <ErrorState
        title={missing ? `There is no such ${what}` : `The ${what} could not be loaded`}
        error={query.error}
        onRetry={missing ? undefined : () => void query.refetch()}
      />
    );
  }
  return <>{children(query.data)}</>;
}

export function Section({
  title,
  id,
  children,
  actions,
  className,
}: {
  title: ReactNode;
  id: string;
  children: ReactNode;
  actions?: ReactNode;
  className?: string;
}) {
  return (
    <section aria-labelledby={id} className={className ?? 'flex flex-col gap-2'}>
      <div className="flex flex-wrap items-end justify-between gap-2">
        <h2 id={id} className="text-base font-semibold text-ink-900">
          {title}
        </h2>
        {actions}
      </div>
      {children}
    </section>
  );
}

export function Property({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-0.5 border-b border-ink-100 py-1.5 last:border-b-0 sm:flex-row sm:gap-4">
      <dt className="w-40 shrink-0 text-sm text-ink-600">{term}</dt>
      <dd className="text-sm text-ink-900">{children}</dd>
    </div>
  );
}
