import { useQuery } from '@tanstack/react-query';
import { Suspense } from 'react';
import { Link, Navigate, NavLink, Outlet, useLocation, useNavigation } from 'react-router';
import { Logo } from '@/components/brand/logo.js';
import { Cautions } from '@/components/ui/cautions.js';
import { Spinner } from '@/components/ui/spinner.js';
import { isMember, sessionQueryOptions } from '@/features/auth/api/get-session.js';
import { cn } from '@/lib/cn.js';
import { navFor } from './nav-items.js';
import { UserMenu } from './user-menu.js';

/** The signed-in frame: brand, role-fitted navigation, the member, the page, and the cautions. */
export function AppFrame() {
  const session = useQuery(sessionQueryOptions());
  const location = useLocation();
  const navigation = useNavigation();
  if (session.data && !isMember(session.data)) {
    // The session ended while the page was open (signed out elsewhere, deactivated, expired).
    return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname + location.search)}`} replace />;
  }
  if (!session.data) return <Spinner label="Loading…" className="m-8" />;
  const s = session.data;
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-50 focus:rounded focus:bg-surface focus:px-3 focus:py-2">
        Skip to content
      </a>
      <header className="border-b border-rule bg-surface">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-8 gap-y-2 px-4 py-3 sm:px-6">
          <Link to="/projects" className="rounded-md" aria-label="Warpmeter, go to projects">
            <Logo />
          </Link>
          <nav aria-label="Main" className="order-last -mx-2 flex w-full gap-1 md:order-none md:w-auto">
            {navFor(s.membership.role).map((item) => (
              <NavLink
                key={item.to}
                to={item.to}
                className={({ isActive }) =>
                  cn(
                    'rounded-md px-3 py-1.5 text-sm font-medium transition-colors',
                    isActive ? 'bg-mulberry-50 text-mulberry-800' : 'text-ink-600 hover:bg-paper hover:text-ink-950',
                  )
                }
              >
                {item.label}
              </NavLink>
            ))}
          </nav>
          <div className="ml-auto">
            <UserMenu session={s} />
          </div>
        </div>
        <div className={cn('h-0.5 bg-saffron-400 transition-opacity', navigation.state === 'loading' ? 'animate-pulse opacity-100' : 'opacity-0')} />
      </header>
      <main id="main" className="mx-auto w-full max-w-7xl flex-1 px-4 py-8 sm:px-6">
        <Suspense fallback={<Spinner label="Loading…" />}>
          <Outlet />
        </Suspense>
      </main>
      <footer className="border-t border-rule bg-surface/60">
        <div className="mx-auto max-w-7xl px-4 py-5 sm:px-6">
          <Cautions compact columns />
        </div>
      </footer>
    </div>
  );
}
