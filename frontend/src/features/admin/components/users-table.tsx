import type { AdminUser } from '@contracts/admin';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { Table, tdClass, thClass } from '@/components/ui/table';
import { formatDate, formatDateTime } from '@/lib/format';
import { useUsers } from '../api/get-users';
import { useSignOutEverywhere } from '../api/sign-out-everywhere';
import { useUpdateUser } from '../api/update-user';

export function UsersTable({ currentUserId }: { currentUserId: number }) {
  const users = useUsers();
  const update = useUpdateUser();
  const signOut = useSignOutEverywhere();

  if (users.isPending) return <Loading label="Loading accounts…" />;
  if (users.isError) return <ErrorNotice error={users.error} title="Accounts could not be loaded" />;
  if (users.data.length === 0) return <EmptyState title="No accounts yet." />;

  const busyId = update.isPending ? update.variables.id : signOut.isPending ? signOut.variables : null;

  return (
    <div className="flex flex-col gap-3">
      <ErrorNotice error={update.error ?? signOut.error} />
      {signOut.isSuccess ? (
        <p role="status" className="text-sm text-ink-700">
          {signOut.data.user.name} was signed out of {signOut.data.sessionsEnded} {signOut.data.sessionsEnded === 1 ? 'browser' : 'browsers'}.
        </p>
      ) : null}
      <Table caption="Accounts" captionHidden>
        <thead>
          <tr>
            <th className={thClass}>Name</th>
            <th className={thClass}>E-mail</th>
            <th className={thClass}>Status</th>
            <th className={`${thClass} text-right`}>Campaigns</th>
            <th className={`${thClass} text-right`}>Signed in</th>
            <th className={thClass}>Created</th>
            <th className={thClass}>Last sign-in</th>
            <th className={thClass}>
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {users.data.map((u) => (
            <UserRow
              key={u.id}
              user={u}
              isSelf={u.id === currentUserId}
              busy={busyId === u.id}
              onChange={(body) => update.mutate({ id: u.id, body })}
              onSignOutEverywhere={() => signOut.mutate(u.id)}
            />
          ))}
        </tbody>
      </Table>
    </div>
  );
}

interface RowProps {
  user: AdminUser;
  isSelf: boolean;
  busy: boolean;
  onChange: (body: { isAdmin?: boolean; disabled?: boolean }) => void;
  onSignOutEverywhere: () => void;
}

function UserRow({ user: u, isSelf, busy, onChange, onSignOutEverywhere }: RowProps) {
  return (
    <tr className={u.disabled ? 'text-ink-500' : undefined}>
      <td className={`${tdClass} font-medium`}>
        {u.name}
        {isSelf ? <span className="ml-1 text-sm font-normal text-ink-500">(you)</span> : null}
      </td>
      <td className={tdClass}>{u.email}</td>
      <td className={`${tdClass} space-x-1`}>
        {u.isAdmin ? <Badge tone="ember">admin</Badge> : null}
        {u.disabled ? <Badge tone="danger">disabled</Badge> : <Badge tone="success">active</Badge>}
      </td>
      <td className={`${tdClass} num text-right`}>{u.campaignCount}</td>
      <td className={`${tdClass} num text-right`} title="Browsers signed in to this account now">
        {u.activeSessions}
      </td>
      <td className={`${tdClass} num whitespace-nowrap`}>{formatDate(u.createdAt)}</td>
      <td className={`${tdClass} num whitespace-nowrap`}>{u.lastLoginAt ? formatDateTime(u.lastLoginAt) : 'never'}</td>
      <td className={`${tdClass} whitespace-nowrap text-right`}>
        {/* Admins cannot lock themselves out from this page; another admin must do it. */}
        {isSelf ? null : (
          <div className="flex justify-end gap-1">
            {/* For a lost laptop or a shared password: ends every browser session, not the access tokens. */}
            <Button variant="secondary" size="sm" disabled={busy || u.activeSessions === 0} aria-label={`Sign ${u.name} out everywhere`} onClick={onSignOutEverywhere}>
              Sign out everywhere
            </Button>
            <Button variant="secondary" size="sm" disabled={busy} aria-label={u.isAdmin ? `Revoke admin from ${u.name}` : `Make ${u.name} an admin`} onClick={() => onChange({ isAdmin: !u.isAdmin })}>
              {u.isAdmin ? 'Revoke admin' : 'Make admin'}
            </Button>
            <Button variant={u.disabled ? 'secondary' : 'danger'} size="sm" disabled={busy} aria-label={`${u.disabled ? 'Enable' : 'Disable'} ${u.name}`} onClick={() => onChange({ disabled: !u.disabled })}>
              {u.disabled ? 'Enable' : 'Disable'}
            </Button>
          </div>
        )}
      </td>
    </tr>
  );
}
