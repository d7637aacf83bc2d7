import { Suspense } from 'react';
import { Link, Outlet, ScrollRestoration, useNavigate, useNavigation } from 'react-router';
import { LogOut } from 'lucide-react';
import { can, roleLabels, type User } from '@lotwise/shared';
import { Wordmark } from '../../components/brand/wordmark';
import { Badge } from '../../components/ui/badge';
import { Button } from '../../components/ui/button';
import { PageSpinner } from '../../components/ui/spinner';
import { paths } from '../../config/paths';
import { useSignOut } from '../../features/auth/api';
import { GlobalSearch } from '../../features/search/components/global-search';
import { SideNav } from './side-nav';

export function AppShell({ user }: { user: User }) {
  const signOut = useSignOut();
  const navigate = useNavigate();
  // A page opened for the first time fetches its code: the page on screen stays meanwhile.
  const opening = useNavigation().state === 'loading';

  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only print:hidden focus:fixed focus:top-2 focus:left-2 focus:z-50 focus:rounded-md focus:bg-white focus:px-3 focus:py-2 focus:shadow"
      >
        Skip to content
      </a>
      <header className="sticky top-0 z-20 flex h-14 print:hidden items-center justify-between gap-4 border-b border-ink-200 bg-white px-4">
        {opening && (
          <span
            aria-hidden="true"
            data-testid="page-opening"
            className="absolute inset-x-0 -bottom-px h-0.5 animate-pulse bg-accent-600"
          />
        )}
        <Link to={paths.home} aria-label="Lotwise, home" className="shrink-0 rounded">
          <Wordmark />
        </Link>
        {can(user.role, 'stock.read') && (
          <div role="search" className="flex flex-1 justify-center">
            <GlobalSearch />
          </div>
        )}
        <div className="flex shrink-0 items-center gap-3 text-sm">
          <Link
            to={paths.account}
            title="Your account: change your password"
            className="hidden rounded text-right hover:underline sm:block"
          >
            <span className="sr-only">Your account: </span>
            <span className="block leading-5 font-medium text-ink-900">{user.displayName}</span>
            <span className="block text-xs leading-4 text-ink-600">{user.email}</span>
          </Link>
          <Badge tone="accent">{roleLabels[user.role]}</Badge>
          <Button
            variant="ghost"
            size="sm"
            busy={signOut.isPending}
            icon={<LogOut aria-hidden="true" className="size-4" />}
            onClick={() =>
              signOut.mutate(undefined, {
                onSettled: () => navigate(paths.signIn, { replace: true }),
              })
            }
          >
            Sign out
          </Button>
        </div>
      </header>
      <div className="flex flex-1 flex-col md:flex-row">
        {/* The column stretches to the page's full height (its border and background with it);
            only the navigation inside it stays in view while the page scrolls. */}
        <aside className="shrink-0 border-b border-ink-200 bg-white md:w-56 md:border-r md:border-b-0 print:hidden">
          <div className="md:sticky md:top-14 md:max-h-[calc(100vh-3.5rem)] md:overflow-y-auto">
            <SideNav role={user.role} />
          </div>
        </aside>
        <main
          id="main"
          tabIndex={-1}
          aria-busy={opening || undefined}
          className="min-w-0 flex-1 px-4 py-6 outline-none md:px-8 print:p-0"
        >
          <div className="mx-auto max-w-7xl print:max-w-none">
            {/* Code a page loads on its own (a chart) waits here, inside the layout. */}
            <Suspense fallback={<PageSpinner label="Opening the page…" />}>
              <Outlet />
            </Suspense>
            {/* A page opened from another starts at its top; back and forward return to where
                the page was, and a change of filters (same path) keeps the place. */}
            <ScrollRestoration getKey={(location) => location.pathname} />
          </div>
        </main>
      </div>
    </div>
  );
}
