import { Page } from '@/components/layout/page';
import { UsersTable } from '@/features/admin/components/users-table';
import { useCurrentUser } from '../current-user';

export function AdminUsersRoute() {
  const user = useCurrentUser();
  return (
    <Page title="Users" subtitle="Everyone with an account on this installation.">
      <UsersTable currentUserId={user.id} />
    </Page>
  );
}
