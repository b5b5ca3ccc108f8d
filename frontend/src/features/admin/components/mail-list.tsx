import { NavLink } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { formatDateTime } from '@/lib/format';
import { useMail } from '../api/get-mail';

export function MailList() {
  const mail = useMail();

  if (mail.isPending) return <Loading label="Loading caught mail…" />;
  if (mail.isError) return <ErrorNotice error={mail.error} title="Caught mail could not be loaded" />;

  return (
    <div className="flex flex-col gap-2">
      <div className="flex items-center justify-between">
        <p className="text-sm text-ink-500">
          <span className="num">{mail.data.length}</span> message{mail.data.length === 1 ? '' : 's'}, newest first
        </p>
        <Button variant="quiet" size="sm" onClick={() => void mail.refetch()}>
          Refresh
        </Button>
      </div>
      {mail.data.length === 0 ? (
        <EmptyState title="No mail caught yet.">Invitations and notices sent by Redward appear here.</EmptyState>
      ) : (
        <ul className="flex flex-col divide-y divide-paper-200 rounded-panel border border-paper-300 bg-paper-50">
          {sortNewestFirst(mail.data).map((m) => (
            <li key={m.id}>
              <NavLink
                to={`/admin/mail/${m.id}`}
                className={({ isActive }) =>
                  `block px-3 py-2 hover:bg-paper-100 ${isActive ? 'border-l-2 border-ember-500 bg-paper-100' : 'border-l-2 border-transparent'}`
                }
              >
                <span className="block truncate font-medium text-ink-900">{m.subject || '(no subject)'}</span>
                <span className="block truncate text-sm text-ink-500">
                  to {m.to} · <span className="num">{formatDateTime(m.receivedAt)}</span>
                </span>
              </NavLink>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

const sortNewestFirst = <T extends { receivedAt: string; id: number }>(list: T[]) =>
  [...list].sort((a, b) => b.receivedAt.localeCompare(a.receivedAt) || b.id - a.id);
