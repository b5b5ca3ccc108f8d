import type { AcceptInvitationResponse } from '@contracts/invitations';
import { Link } from 'react-router-dom';
import { Button, buttonClass } from '@/components/ui/button';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { useAcceptInvitation } from '../api/accept-invitation';

interface Props {
  token: string;
  invitedEmail: string;
  /** E-mail of whoever is signed in in this browser, or null. */
  viewerEmail: string | null;
  signInHref: string;
  onAccepted: (result: AcceptInvitationResponse) => void;
}

/** For an address that already has an account: joining needs that account signed in, never a new password. */
export function JoinExisting({ token, invitedEmail, viewerEmail, signInHref, onAccepted }: Props) {
  const accept = useAcceptInvitation(token);
  const isInvitee = viewerEmail !== null && viewerEmail.toLowerCase() === invitedEmail.toLowerCase();

  if (isInvitee) {
    return (
      <div className="flex flex-col gap-3">
        <ErrorNotice error={accept.error} />
        <p>You are signed in as {viewerEmail}.</p>
        <div>
          <Button pending={accept.isPending} pendingLabel="Joining…" onClick={() => accept.mutate({}, { onSuccess: onAccepted })}>
            Join campaign
          </Button>
        </div>
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-3">
      {viewerEmail ? (
        <Notice tone="warning">
          You are signed in as {viewerEmail}, but this invitation is for {invitedEmail}. Sign in as {invitedEmail} to join.
        </Notice>
      ) : (
        <p>{invitedEmail} already has a Redward account. Sign in with it to join the campaign.</p>
      )}
      <div>
        <Link to={signInHref} className={buttonClass('primary')}>
          Sign in as {invitedEmail}
        </Link>
      </div>
    </div>
  );
}
