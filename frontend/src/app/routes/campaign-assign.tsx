import type { Campaign } from '@contracts/campaigns';
import { useQueryClient } from '@tanstack/react-query';
import { Page } from '@/components/layout/page';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { Panel } from '@/components/ui/panel';
import { AssignReadersForm } from '@/features/assignments/components/assign-readers-form';
import type { ReaderCandidate } from '@/features/assignments/components/assign-readers-form';
import { inspectKeys } from '@/features/inspect/api/keys';
import { useMembers } from '@/features/members/api/get-members';
import { spectraKeys } from '@/features/spectra/api/keys';
import { CampaignEyebrow } from './campaign-link';
import { WithCampaign } from './with-campaign';

/** Loaded lazily (see router.tsx). */
export function CampaignAssignRoute() {
  return <WithCampaign>{(campaign) => <AssignPage campaign={campaign} />}</WithCampaign>;
}

function AssignPage({ campaign }: { campaign: Campaign }) {
  const members = useMembers(campaign.id);
  const queryClient = useQueryClient();
  const title = 'Assign readers';
  const eyebrow = <CampaignEyebrow campaign={campaign} />;

  if (campaign.myRole !== 'lead') {
    return (
      <Page title={title} eyebrow={eyebrow}>
        <Notice tone="warning">Only the campaign's leads assign readers.</Notice>
      </Page>
    );
  }

  // Observers never read; leads may take readings like anyone else.
  const candidates: ReaderCandidate[] = (members.data?.members ?? []).flatMap((m) => (m.role === 'observer' ? [] : [{ userId: m.userId, name: m.name, email: m.email, role: m.role }]));

  return (
    <Page title={title} eyebrow={eyebrow} subtitle="Every spectrum is read blind by two different people; assigning fills in the spectra that have no readers yet.">
      <Panel title="Choose readers">
        {members.isPending ? (
          <Loading label="Loading members…" />
        ) : members.isError ? (
          <ErrorNotice error={members.error} />
        ) : (
          <AssignReadersForm
            campaignId={campaign.id}
            candidates={candidates}
            onAssigned={() => {
              void queryClient.invalidateQueries({ queryKey: spectraKeys.lists(campaign.id) });
              void queryClient.invalidateQueries({ queryKey: inspectKeys.queues() });
            }}
          />
        )}
      </Panel>
    </Page>
  );
}
