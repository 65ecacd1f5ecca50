import { useEffect, useRef } from 'react';
import { Link, NavLink, Outlet, ScrollRestoration, useLocation, useNavigation } from 'react-router';
import { Button } from '@client/components/ui/button';
import { RoleBadge } from '@client/components/ui/role-badge';
import { Wordmark } from '@client/components/ui/wordmark';
import { useCurrentUser } from '@client/features/session/api/get-me';
import { useSignOut } from '@client/features/session/api/sign-out';
import { sortRoles } from '@client/features/session/lib/roles';
import { navigationFor } from './navigation';

/** First focusable thing on every signed-in page. */
export function SkipLink() {
  return (
    <a
      href="#main"
      className="sr-only z-50 rounded-[3px] bg-reference px-3 py-2 font-semibold text-white no-underline focus:not-sr-only focus:fixed focus:top-2 focus:left-2"
    >
      Skip to content
    </a>
  );
}

/** A thin line at the top while the router loads the next page. */
function NavigationProgress() {
  const navigation = useNavigation();
  if (navigation.state === 'idle') return null;
  return (
    <div className="fixed inset-x-0 top-0 z-40 h-0.5 overflow-hidden bg-rule" aria-hidden="true">
      <div className="skeleton h-full w-full bg-reference" />
    </div>
  );
}

function SignOutButton() {
  const signOut = useSignOut();
  return (
    <div className="flex items-center gap-2">
      {signOut.isError ? (
        <span role="alert" className="text-sm text-antibonding">
          Sign-out failed; try again.
        </span>
      ) : null}
      <Button
        size="sm"
        onClick={() => signOut.mutate()}
        disabled={signOut.isPending}
        aria-busy={signOut.isPending || undefined}
        data-testid="sign-out"
      >
        Sign out
      </Button>
    </div>
  );
}

function Header() {
  const me = useCurrentUser();
  const roles = sortRoles(me.roles);
  return (
    <header className="border-b border-rule bg-sheet">
      <div className="flex flex-wrap items-center justify-between gap-x-6 gap-y-2 px-4 py-2.5 lg:px-6">
        <Link to="/" className="rounded-[3px] no-underline">
          <Wordmark />
        </Link>
        <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
          <div className="flex flex-col items-end leading-tight">
            <span className="font-semibold text-ink" data-testid="user-name">
              {me.displayName}
            </span>
            <span className="text-[0.8rem] text-graphite">{me.email}</span>
          </div>
          <ul className="flex flex-wrap gap-1" aria-label="Your roles" data-testid="user-roles">
            {roles.map((role) => (
              <li key={role}>
                <RoleBadge role={role} />
              </li>
            ))}
          </ul>
          <SignOutButton />
        </div>
      </div>
    </header>
  );
}

function SideNavigation() {
  const me = useCurrentUser();
  const items = navigationFor(me);
  return (
    <nav aria-label="Main" className="border-b border-rule bg-paper lg:w-52 lg:shrink-0 lg:border-r lg:border-b-0">
      <ul className="flex flex-wrap gap-1 px-3 py-2 lg:sticky lg:top-0 lg:flex-col lg:gap-0.5 lg:px-3 lg:py-4">
        {items.map((item) => (
          <li key={item.to + item.label}>
            <NavLink
              to={item.to}
              end={item.end}
              data-testid={`nav-${item.label.toLowerCase().replace(/\s+/g, '-')}`}
              className={({ isActive }) =>
                'block rounded-[3px] border-b-2 px-3 py-1.5 no-underline transition-colors lg:border-b-0 lg:border-l-[3px] ' +
                (isActive
                  ? 'border-reference bg-wash font-semibold text-ink'
                  : 'border-transparent text-ink hover:bg-wash')
              }
            >
              {item.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}

/**
 * The signed-in frame: skip link, header (name, roles, Sign out), role-based
 * navigation and the page in <main id="main">. Focus moves to <main> when the
 * path changes, so screen-reader and keyboard users start at the new page.
 */
export function AppLayout() {
  const location = useLocation();
  const mainRef = useRef<HTMLElement>(null);
  const firstRender = useRef(true);

  useEffect(() => {
    if (firstRender.current) {
      firstRender.current = false;
      return;
    }
    mainRef.current?.focus({ preventScroll: true });
  }, [location.pathname]);

  return (
    <div className="flex min-h-screen flex-col">
      <SkipLink />
      <NavigationProgress />
      <Header />
      <div className="flex flex-1 flex-col lg:flex-row">
        <SideNavigation />
        <main id="main" ref={mainRef} tabIndex={-1} className="min-w-0 flex-1 px-4 py-5 outline-none lg:px-8 lg:py-6">
          <div className="mx-auto max-w-[1200px]">
            <Outlet />
          </div>
        </main>
      </div>
      <ScrollRestoration />
    </div>
  );
}
