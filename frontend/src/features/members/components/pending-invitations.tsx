import type { PendingInvitation } from '@contracts/campaigns';
import { RoleBadge } from '@/components/ui/role-badge';
import { Table, tdClass, thClass } from '@/components/ui/table';
import { formatDateTime } from '@/lib/format';

export function PendingInvitations({ invitations }: { invitations: PendingInvitation[] }) {
  if (invitations.length === 0) {
    return (
      <div>
        <h3 className="mb-2 text-md font-semibold text-ink-900">Pending invitations</h3>
        <p className="text-ink-500">None. An invitation waits here until it is accepted or expires.</p>
      </div>
    );
  }
  return (
    <Table caption="Pending invitations">
      <thead>
        <tr>
          <th className={thClass}>E-mail</th>
          <th className={thClass}>Role</th>
          <th className={thClass}>Invited by</th>
          <th className={thClass}>Expires</th>
        </tr>
      </thead>
      <tbody>
        {invitations.map((inv) => (
          <tr key={inv.id}>
            <td className={tdClass}>{inv.email}</td>
            <td className={tdClass}>
              <RoleBadge role={inv.role} />
            </td>
            <td className={`${tdClass} text-ink-600`}>{inv.invitedBy}</td>
            <td className={`${tdClass} num whitespace-nowrap text-ink-600`}>{formatDateTime(inv.expiresAt)}</td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
