import { Outlet, useParams } from 'react-router-dom';
import { Page } from '@/components/layout/page';
import { MailList } from '@/features/admin/components/mail-list';
import { MailMessageView } from '@/features/admin/components/mail-message';

export function AdminMailRoute() {
  return (
    <Page title="Caught mail" subtitle="Messages Redward sent while the local mail catcher stands in for a mail server.">
      <div className="grid grid-cols-1 gap-5 lg:grid-cols-[22rem_1fr]">
        <MailList />
        <section aria-label="Message" className="min-w-0 rounded-panel border border-paper-300 bg-paper-50 p-4">
          <Outlet />
        </section>
      </div>
    </Page>
  );
}

export function NoMessageSelected() {
  return <p className="text-ink-500">Choose a message to read it.</p>;
}

export function AdminMailMessageRoute() {
  const id = Number(useParams().messageId);
  if (!Number.isInteger(id) || id <= 0) return <p className="text-ink-500">There is no such message.</p>;
  return <MailMessageView key={id} id={id} />;
}
