import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';

/** The secret is shown this once: the server keeps only its hash, so a lost token must be replaced. */
export function NewTokenNotice({ token, name, onDismiss }: { token: string; name: string; onDismiss: () => void }) {
  const [copied, setCopied] = useState<'yes' | 'failed' | null>(null);
  const copy = () =>
    navigator.clipboard.writeText(token).then(
      () => setCopied('yes'),
      () => setCopied('failed'),
    );

  return (
    <Notice tone="warning" title={`Copy the token “${name}” now`}>
      <p>This is the only time Redward shows it. Store it where your script reads secrets; if it is lost, revoke it and create another.</p>
      <div className="mt-2 flex flex-wrap items-center gap-2">
        <code aria-label="New token" className="num rounded-control border border-warning-700/30 bg-paper-50 px-2 py-1 text-ink-900 [overflow-wrap:anywhere]">
          {token}
        </code>
        <Button variant="secondary" size="sm" onClick={() => void copy()}>
          Copy token
        </Button>
        <Button variant="quiet" size="sm" onClick={onDismiss}>
          I have stored it
        </Button>
        <span role="status" className="text-sm">
          {copied === 'yes' ? 'Copied to the clipboard.' : copied === 'failed' ? 'The browser refused the clipboard; select the token and copy it by hand.' : ''}
        </span>
      </div>
    </Notice>
  );
}
