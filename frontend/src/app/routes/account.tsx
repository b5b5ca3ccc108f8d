import { Page } from '@/components/layout/page';
import { Panel } from '@/components/ui/panel';
import { ApiTokens } from '@/features/account/components/api-tokens';
import { NameForm } from '@/features/account/components/name-form';
import { PasswordForm } from '@/features/account/components/password-form';
import { useCurrentUser } from '../current-user';

export function AccountRoute() {
  const user = useCurrentUser();
  return (
    <Page title="Account" subtitle={<>Signed in as <span className="font-medium text-ink-900">{user.email}</span></>}>
      <div className="grid max-w-4xl grid-cols-1 items-start gap-5 md:grid-cols-2">
        <Panel title="Name">
          <p className="mb-3 text-sm text-ink-500">Shown to your collaborators on readings and in invitations.</p>
          <NameForm currentName={user.name} />
        </Panel>
        <Panel title="Password">
          <PasswordForm />
        </Panel>
      </div>
      <Panel title="Personal access tokens" className="max-w-4xl">
        <ApiTokens />
      </Panel>
    </Page>
  );
}
