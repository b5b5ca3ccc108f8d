import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { formatDateTime } from '@/lib/format';
import { useMailMessage } from '../api/get-mail-message';
import { MailBody } from './mail-body';

export function MailMessageView({ id }: { id: number }) {
  const message = useMailMessage(id);
  const [showHtml, setShowHtml] = useState(false);

  if (message.isPending) return <Loading label="Opening message…" />;
  if (message.isError) return <ErrorNotice error={message.error} title="The message could not be opened" />;

  const m = message.data;
  return (
    <article className="flex flex-col gap-3" aria-labelledby="mail-subject">
      <header className="flex flex-col gap-1">
        <h2 id="mail-subject" className="text-lg font-semibold text-ink-950">
          {m.subject || '(no subject)'}
        </h2>
        <dl className="grid grid-cols-[4rem_1fr] gap-x-2 text-sm text-ink-600">
          <dt>From</dt>
          <dd>{m.from}</dd>
          <dt>To</dt>
          <dd>{m.to}</dd>
          <dt>Caught</dt>
          <dd className="num">{formatDateTime(m.receivedAt)}</dd>
        </dl>
      </header>
      <MailBody text={m.text} />
      {m.html !== null ? (
        <div className="flex flex-col gap-2">
          <div>
            <Button variant="quiet" size="sm" aria-expanded={showHtml} onClick={() => setShowHtml((v) => !v)}>
              {showHtml ? 'Hide HTML version' : 'Show HTML version'}
            </Button>
          </div>
          {/* An empty sandbox: no scripts, no forms, no same-origin access to this app's session. */}
          {showHtml ? (
            <iframe title={`HTML version of ${m.subject}`} sandbox="" srcDoc={m.html} className="h-96 w-full rounded-control border border-paper-300 bg-white" />
          ) : null}
        </div>
      ) : null}
    </article>
  );
}
