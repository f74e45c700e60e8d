import { useQuery } from '@tanstack/react-query';
import { Link, NavLink, Navigate, Outlet, useLocation } from 'react-router-dom';
import type { ApiUser } from '../../shared/api';
import { Avatar } from '../components/ui/avatar';
import { Button } from '../components/ui/button';
import { LoadingState } from '../components/ui/spinner';
import { ErrorState } from '../components/ui/error-state';
import { Wordmark } from '../components/ui/wordmark';
import { meQueryOptions, useSignOut } from '../features/auth';
import { cn } from '../lib/cn';
import { notifyError } from '../lib/notify';
import { safeNext, signInPath } from '../lib/safe-next';

function navClass({ isActive }: { isActive: boolean }) {
  return cn('rounded px-2.5 py-1 text-sm transition-colors', isActive ? 'bg-mat-800 text-amber-300' : 'text-slate-300 hover:text-slate-100');
}

function UserMenu({ user }: { user: ApiUser }) {
  const signOut = useSignOut();
  return (
    <div className="flex items-center gap-3">
      <span className="flex items-center gap-2 text-sm text-slate-200" data-testid="current-user">
        <Avatar name={user.name} userId={user.id} size="sm" />
        <span className="hidden sm:inline">{user.name}</span>
        {user.isAdmin && <span className="rounded border border-mat-600 px-1 font-mono text-[10px] text-slate-400">admin</span>}
      </span>
      <Button
        size="sm"
        variant="ghost"
        busy={signOut.isPending}
        onClick={() => signOut.mutate(undefined, { onError: (err) => notifyError(err, 'Could not sign out') })}
      >
        Sign out
      </Button>
    </div>
  );
}

/** The top bar: wordmark, Boards, Outbox (site admins), and who is signed in. */
function TopBar() {
  const me = useQuery(meQueryOptions);
  const user = me.data ?? null;
  const location = useLocation();
  // from any page but the account pages, signing in or up comes back to it (an invitation, a board link)
  const onAccountPage = /^\/(signin|signup|reset)/.test(location.pathname);
  const next = onAccountPage ? new URLSearchParams(location.search).get('next') : location.pathname + location.search;
  const accountLink = (base: '/signin' | '/signup') => (next && next !== '/' ? signInPath(safeNext(next), base) : base);
  return (
    <header className="flex h-11 shrink-0 items-center justify-between gap-4 border-b border-mat-700 bg-mat-900/95 px-4">
      <div className="flex items-center gap-5">
        <Link to={user ? '/boards' : '/signin'} aria-label="Gatefold home">
          <Wordmark />
        </Link>
        {user && (
          <nav aria-label="Main" className="flex items-center gap-1">
            <NavLink to="/boards" className={navClass}>
              Boards
            </NavLink>
            {user.isAdmin && (
              <NavLink to="/outbox" className={navClass}>
                Outbox
              </NavLink>
            )}
          </nav>
        )}
      </div>
      {user ? (
        <UserMenu user={user} />
      ) : me.isPending ? null : (
        <nav aria-label="Account" className="flex items-center gap-1">
          <NavLink to={accountLink('/signin')} className={navClass}>
            Sign in
          </NavLink>
          <NavLink to={accountLink('/signup')} className={navClass}>
            Sign up
          </NavLink>
        </nav>
      )}
    </header>
  );
}

/** Every page: the top bar over the bench surface; the page decides its own width. */
export function RootLayout() {
  return (
    <div className="mat-grid flex h-full min-h-0 flex-col">
      <TopBar />
      <main className="flex min-h-0 flex-1 flex-col overflow-auto">
        <Outlet />
      </main>
    </div>
  );
}

/** A centred column for the ordinary (non-board) pages. */
export function PageColumn({ children, width = 'wide' }: { children: React.ReactNode; width?: 'narrow' | 'wide' }) {
  return <div className={cn('mx-auto w-full px-4 py-8', width === 'narrow' ? 'max-w-md' : 'max-w-5xl')}>{children}</div>;
}

/** Pages that need an account: sends a signed-out visitor to sign in, then back here. */
export function RequireUser() {
  const me = useQuery(meQueryOptions);
  const location = useLocation();
  if (me.isPending) return <LoadingState label="Checking your session…" />;
  if (me.isError)
    return (
      <PageColumn>
        <ErrorState error={me.error} onRetry={() => me.refetch()} />
      </PageColumn>
    );
  if (!me.data) return <Navigate to={signInPath(location.pathname + location.search)} replace />;
  return <Outlet />;
}
