import { useState } from 'react';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { useTokens } from '../api/get-tokens';
import { CreateTokenForm } from './create-token-form';
import { NewTokenNotice } from './new-token-notice';
import { TokensTable } from './tokens-table';

/** Tokens let scripts use the API as this person, with the same campaign roles. */
export function ApiTokens() {
  const tokens = useTokens();
  const [fresh, setFresh] = useState<{ token: string; name: string } | null>(null);
  return (
    <div className="flex flex-col gap-4">
      <p className="text-sm text-ink-600">
        Send a token from a script as the header <code className="num text-ink-900">Authorization: Bearer &lt;token&gt;</code>; it acts as you, with your roles in each campaign.
      </p>
      <CreateTokenForm onCreated={(token, name) => setFresh({ token, name })} />
      {fresh ? <NewTokenNotice token={fresh.token} name={fresh.name} onDismiss={() => setFresh(null)} /> : null}
      {tokens.isPending ? <Loading label="Loading tokens…" /> : tokens.isError ? <ErrorNotice error={tokens.error} /> : <TokensTable tokens={tokens.data} />}
    </div>
  );
}
