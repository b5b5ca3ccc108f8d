import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { useMembers } from '../api/get-members';
import { InviteForm } from './invite-form';
import { MembersTable } from './members-table';
import { PendingInvitations } from './pending-invitations';

/** Everyone sees who is in the campaign; only leads see the invitation tools. */
export function CampaignMembers({ campaignId, isLead }: { campaignId: number; isLead: boolean }) {
  const members = useMembers(campaignId);

  return (
    <div className="flex flex-col gap-5">
      {members.isPending ? (
        <Loading label="Loading members…" />
      ) : members.isError ? (
        <ErrorNotice error={members.error} title="Members could not be loaded" />
      ) : (
        <MembersTable members={members.data.members} />
      )}
      {isLead ? (
        <>
          <section aria-labelledby="invite-heading" className="flex flex-col gap-2 border-t border-paper-200 pt-4">
            <h3 id="invite-heading" className="text-md font-semibold">
              Invite a colleague
            </h3>
            <InviteForm campaignId={campaignId} />
          </section>
          {members.data ? <PendingInvitations invitations={members.data.invitations} /> : null}
        </>
      ) : null}
    </div>
  );
}
