import { Outlet } from 'react-router-dom';
import { Page } from '@/components/layout/page';
import { Notice } from '@/components/ui/notice';
import { useCurrentUser } from '../current-user';

/** Hides admin pages from others; the API refuses them regardless. */
export function RequireAdmin() {
  const user = useCurrentUser();
  if (!user.isAdmin) {
    return (
      <Page title="Administrators only">
        <Notice tone="warning">This page is for the administrators of this Redward installation.</Notice>
      </Page>
    );
  }
  return <Outlet />;
}
