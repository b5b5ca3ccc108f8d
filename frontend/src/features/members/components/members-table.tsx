import type { Member } from '@contracts/campaigns';
import { EmptyState } from '@/components/ui/empty-state';
import { RoleBadge } from '@/components/ui/role-badge';
import { Table, tdClass, thClass } from '@/components/ui/table';
import { formatDate } from '@/lib/format';

export function MembersTable({ members }: { members: Member[] }) {
  if (members.length === 0) return <EmptyState title="No members yet." />;
  return (
    <Table caption="Members">
      <thead>
        <tr>
          <th className={thClass}>Name</th>
          <th className={thClass}>E-mail</th>
          <th className={thClass}>Role</th>
          <th className={thClass}>Joined</th>
        </tr>
      </thead>
      <tbody>
        {members.map((m) => (
          <tr key={m.userId}>
            <td className={`${tdClass} font-medium`}>{m.name}</td>
            <td className={`${tdClass} text-ink-600`}>{m.email}</td>
            <td className={tdClass}>
              <RoleBadge role={m.role} />
            </td>
            <td className={`${tdClass} num whitespace-nowrap text-ink-600`}>{formatDate(m.joinedAt)}</td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
