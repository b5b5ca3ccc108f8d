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
        <div className="grid grid-cols-1 gap-5 border-t border-paper-200 pt-4 lg:grid-cols-2">
          <section aria-labelledby="invite-heading" className="flex flex-col gap-2">
            <h3 id="invite-heading" className="text-md font-semibold">
              Invite a colleague
            </h3>
            <InviteForm campaignId={campaignId} />
          </section>
          <div className="min-w-0">{members.data ? <PendingInvitations invitations={members.data.invitations} /> : null}</div>
        </div>
      ) : null}
    </div>
  );
}
