import { Link, NavLink, useLocation } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { ErrorNotice } from '@/components/ui/notice';
import { useMe } from '@/features/auth/api/get-me';
import { useSignOut } from '@/features/auth/api/sign-out';
import { signInPath } from '@/lib/session';
import { Brand } from './brand';

const navClass = ({ isActive }: { isActive: boolean }) =>
  `whitespace-nowrap rounded-control px-2.5 py-1 text-base ${isActive ? 'bg-ink-800 text-paper-50 shadow-[inset_0_-2px_0_var(--color-ember-500)]' : 'text-ink-300 hover:bg-ink-800 hover:text-paper-50'}`;

export function TopBar() {
  const me = useMe();
  const signOut = useSignOut();
  const location = useLocation();
  const user = me.data ?? null;

  const onSignOut = () =>
    signOut.mutate(undefined, {
      // A full load of the sign-in page drops every cached answer of the person who left.
      onSuccess: () => window.location.assign('/sign-in'),
    });

  return (
    <header className="bg-ink-950 text-paper-100">
      <div className="mx-auto flex min-h-12 max-w-6xl flex-wrap items-center gap-x-6 gap-y-1 px-5 py-1.5">
        <Brand />
        {user ? (
          <nav aria-label="Main" className="flex items-center gap-1">
            <NavLink to="/campaigns" className={navClass}>
              Campaigns
            </NavLink>
            {user.isAdmin ? (
              <>
                <NavLink to="/admin/users" className={navClass}>
                  Users
                </NavLink>
                <NavLink to="/admin/mail" className={navClass}>
                  Caught mail
                </NavLink>
              </>
            ) : null}
          </nav>
        ) : null}
        <div className="ml-auto flex items-center gap-3">
          {user ? (
            <>
              <Link to="/account" className="whitespace-nowrap rounded-control px-1 text-base text-paper-100 hover:underline" title={user.email}>
                {user.name}
                {user.isAdmin ? <span className="ml-1.5 text-xs uppercase tracking-wide text-ember-400">admin</span> : null}
              </Link>
              <Button variant="secondary" size="sm" pending={signOut.isPending} onClick={onSignOut}>
                Sign out
              </Button>
            </>
          ) : location.pathname !== '/sign-in' && !me.isPending ? (
            <Link to={signInPath(location.pathname + location.search)} className="text-base text-paper-100 hover:underline">
              Sign in
            </Link>
          ) : null}
        </div>
      </div>
      {signOut.isError ? (
        <div className="mx-auto max-w-6xl px-5 pb-2">
          <ErrorNotice error={signOut.error} title="Signing out failed" />
        </div>
      ) : null}
    </header>
  );
}
