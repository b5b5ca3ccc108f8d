import type { AcceptInvitationResponse } from '@contracts/invitations';
import { Page } from '@/components/layout/page';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { RoleBadge } from '@/components/ui/role-badge';
import { formatDateTime } from '@/lib/format';
import { useInvitation } from '../api/get-invitation';
import { JoinExisting } from './join-existing';
import { NewAccountForm } from './new-account-form';

interface Props {
  token: string;
  viewerEmail: string | null;
  signInHref: string;
  onAccepted: (result: AcceptInvitationResponse) => void;
}

export function AcceptInvitation({ token, viewerEmail, signInHref, onAccepted }: Props) {
  const invitation = useInvitation(token);

  if (invitation.isPending) return <Loading label="Checking the invitation…" />;
  if (invitation.isError) {
    // Expired, used or unknown links: the server's sentence says which, and is shown as is.
    return (
      <Page title="This invitation cannot be used">
        <div className="max-w-xl">
          <ErrorNotice error={invitation.error} />
          <p className="mt-3 text-ink-600">Ask the campaign lead to send you a new invitation.</p>
        </div>
      </Page>
    );
  }

  const inv = invitation.data;
  return (
    <Page
      eyebrow="Invitation"
      title={`Join ${inv.campaign.name}`}
      subtitle={
        <span>
          {inv.invitedBy} invited <strong className="font-medium text-ink-900">{inv.email}</strong> as <RoleBadge role={inv.role} />
          <span className="ml-2 text-sm text-ink-500">Link valid until <span className="num">{formatDateTime(inv.expiresAt)}</span></span>
        </span>
      }
    >
      <div className="max-w-md rounded-panel border border-paper-300 bg-paper-50 p-5">
        {inv.accountExists ? (
          <JoinExisting token={token} invitedEmail={inv.email} viewerEmail={viewerEmail} signInHref={signInHref} onAccepted={onAccepted} />
        ) : (
          <NewAccountForm token={token} email={inv.email} onAccepted={onAccepted} />
        )}
      </div>
    </Page>
  );
}
