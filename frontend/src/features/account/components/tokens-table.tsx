import type { ApiToken } from '@contracts/auth';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorNotice } from '@/components/ui/notice';
import { Table, tdClass, thClass } from '@/components/ui/table';
import { formatDateTime } from '@/lib/format';
import { useRevokeToken } from '../api/revoke-token';

/** Revoked tokens stay listed, so the person can see what a script was using and when it stopped. */
export function TokensTable({ tokens }: { tokens: ApiToken[] }) {
  const revoke = useRevokeToken();
  if (tokens.length === 0) return <EmptyState title="No tokens yet">Create one for each script or notebook that talks to Redward.</EmptyState>;
  return (
    <div className="flex flex-col gap-2">
      <ErrorNotice error={revoke.error} />
      <Table caption="Your personal access tokens" captionHidden>
        <thead>
          <tr>
            {['Name', 'Starts with', 'Created', 'Last used', 'State', ''].map((h, i) => (
              <th key={i} scope="col" className={thClass}>
                {h || <span className="sr-only">Actions</span>}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {tokens.map((t) => (
            <tr key={t.id}>
              <td className={`${tdClass} font-medium`}>{t.name}</td>
              <td className={`${tdClass} num`}>{t.prefix}…</td>
              <td className={`${tdClass} num whitespace-nowrap`}>{formatDateTime(t.createdAt)}</td>
              <td className={`${tdClass} num whitespace-nowrap`}>{t.lastUsedAt ? formatDateTime(t.lastUsedAt) : 'never'}</td>
              <td className={tdClass}>{t.revokedAt ? <Badge tone="danger">revoked {formatDateTime(t.revokedAt)}</Badge> : <Badge tone="success">active</Badge>}</td>
              <td className={`${tdClass} text-right`}>
                {t.revokedAt ? null : (
                  <Button variant="danger" size="sm" pending={revoke.isPending && revoke.variables === t.id} pendingLabel="Revoking…" onClick={() => revoke.mutate(t.id)}>
                    Revoke {t.name}
                  </Button>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </Table>
    </div>
  );
}
