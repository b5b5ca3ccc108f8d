import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { Page } from '@/components/layout/page';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { useMe } from '@/features/auth/api/get-me';
import { signInPath } from '@/lib/session';

export function RequireAuth() {
  const me = useMe();
  const location = useLocation();

  if (me.isPending) return <Loading label="Checking your session…" />;
  if (me.isError) {
    return (
      <Page title="Redward cannot check your session">
        <ErrorNotice error={me.error} />
        <div>
          <Button variant="secondary" onClick={() => void me.refetch()}>
            Try again
          </Button>
        </div>
      </Page>
    );
  }
  if (!me.data) return <Navigate to={signInPath(location.pathname + location.search)} replace />;
  return <Outlet />;
}
