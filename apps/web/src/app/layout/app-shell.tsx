import { lazy, Suspense } from 'react';
import { Link, Outlet, ScrollRestoration, useNavigate, useNavigation } from 'react-router';
import { LogOut, Menu, X } from 'lucide-react';
import { can, roleLabels, type User } from '@lotwise/shared';
import { Wordmark } from '../../components/brand/wordmark';
import { Badge } from '../../components/ui/badge';
import { Button } from '../../components/ui/button';
import { PageSpinner } from '../../components/ui/spinner';
import { paths } from '../../config/paths';
import { useSignOut } from '../../features/auth/api';
import { ScanLabelButton } from '../../features/label-scan/components/scan-label-button';
import { GlobalSearch } from '../../features/search/components/global-search';
import { cn } from '../../lib/cn';
import { SideNav } from './side-nav';
import { useNavMenu } from './use-nav-menu';

// The shortcuts and their overlay load just after the first page shows: no page needs them to
// open, and the chemicals list keeps within its size budget (bench/web-size.ts).
const KeyboardShortcuts = lazy(async () => ({
  default: (await import('../../components/shortcuts/keyboard-shortcuts')).KeyboardShortcuts,
}));

function SignOutButton({ className }: { className?: string }) {
  const signOut = useSignOut();
  const navigate = useNavigate();
  return (
    <Button
      variant="ghost"
      size="sm"
      className={className}
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
  );
}

/** Who is signed in, inside the menu on a phone (the header has no room for it there). */
function MenuAccount({ user }: { user: User }) {
  return (
    <div className="flex flex-col gap-2 border-t border-ink-200 px-5 py-4 md:hidden">
      <div className="flex flex-wrap items-center gap-2">
        <Link to={paths.account} className="min-w-0 rounded text-sm pointer-coarse:py-1">
          <span className="sr-only">Your account: </span>
          <span className="block leading-5 font-medium text-ink-900">{user.displayName}</span>
          <span className="block text-xs leading-4 break-all text-ink-600">{user.email}</span>
        </Link>
        <Badge tone="accent">{roleLabels[user.role]}</Badge>
      </div>
      <SignOutButton className="self-start" />
    </div>
  );
}

export function AppShell({ user }: { user: User }) {
  // A page opened for the first time fetches its code: the page on screen stays meanwhile.
  const opening = useNavigation().state === 'loading';
  const { open: menuOpen, buttonRef, panelRef, panelId, toggle, panelHandlers } = useNavMenu();

  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only print:hidden focus:fixed focus:top-2 focus:left-2 focus:z-50 focus:rounded-md focus:bg-white focus:px-3 focus:py-2 focus:shadow"
      >
        Skip to content
      </a>
      <header className="sticky top-0 z-20 flex h-14 print:hidden items-center justify-between gap-2 border-b border-ink-200 bg-white px-3 sm:gap-4 sm:px-4">
        {opening && (
          <span
            aria-hidden="true"
            data-testid="page-opening"
            className="absolute inset-x-0 -bottom-px h-0.5 animate-pulse bg-accent-600"
          />
        )}
        <Button
          ref={buttonRef}
          variant="ghost"
          className="shrink-0 md:hidden"
          aria-expanded={menuOpen}
          aria-controls={panelId}
          icon={
            menuOpen ? (
              <X aria-hidden="true" className="size-5" />
            ) : (
              <Menu aria-hidden="true" className="size-5" />
            )
          }
          onClick={toggle}
          onKeyDown={panelHandlers.onKeyDown}
        >
          Menu
        </Button>
        <Link
          to={paths.home}
          aria-label="Lotwise, home"
          className="shrink-0 rounded pointer-coarse:py-2.5"
        >
          {/* On a phone the mark alone: the search needs the room. */}
          <Wordmark className="max-sm:[&>span]:sr-only" />
        </Link>
        {can(user.role, 'stock.read') && (
          <div role="search" className="flex flex-1 justify-center gap-2">
            <GlobalSearch />
            <ScanLabelButton />
          </div>
        )}
        <div className="flex shrink-0 items-center gap-3 text-sm max-md:hidden">
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
          <SignOutButton />
        </div>
      </header>
      <div className="flex flex-1 flex-col md:flex-row">
        {/* The column stretches to the page's full height (its border and background with it);
            only the navigation inside it stays in view while the page scrolls. */}
        {/* On a phone the column is the menu: hidden until the header's button opens it over
            the page, below the header. */}
        <aside
          id={panelId}
          ref={panelRef}
          aria-label="Menu"
          data-open={menuOpen}
          {...panelHandlers}
          className={cn(
            'shrink-0 bg-white md:w-56 md:border-r md:border-ink-200 print:hidden',
            menuOpen
              ? 'max-md:fixed max-md:inset-x-0 max-md:top-14 max-md:bottom-0 max-md:z-30 max-md:overflow-y-auto max-md:shadow-lg'
              : 'max-md:hidden',
          )}
        >
          <div className="md:sticky md:top-14 md:max-h-[calc(100vh-3.5rem)] md:overflow-y-auto">
            <SideNav role={user.role} />
            <MenuAccount user={user} />
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
      <Suspense fallback={null}>
        <KeyboardShortcuts role={user.role} />
      </Suspense>
    </div>
  );
}
