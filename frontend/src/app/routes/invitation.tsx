import { useNavigate, useParams } from 'react-router-dom';
import { Loading } from '@/components/ui/loading';
import { useMe } from '@/features/auth/api/get-me';
import { AcceptInvitation } from '@/features/invitations/components/accept-invitation';
import { signInPath } from '@/lib/session';

/** Open to everyone: a new person has no session yet, an existing one may be signed in or not. */
export function InvitationRoute() {
  const token = useParams().token ?? '';
  const navigate = useNavigate();
  const me = useMe();

  if (me.isPending) return <Loading label="Checking your session…" />;
  return (
    <AcceptInvitation
      token={token}
      viewerEmail={me.data?.email ?? null}
      signInHref={signInPath(`/invitations/${token}`)}
      onAccepted={({ campaignId }) => void navigate(`/campaigns/${campaignId}`, { replace: true })}
    />
  );
}
