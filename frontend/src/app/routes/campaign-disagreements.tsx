import type { Campaign } from '@contracts/campaigns';
import { useQueryClient } from '@tanstack/react-query';
import { Page } from '@/components/layout/page';
import { Notice } from '@/components/ui/notice';
import { confirmedKeys } from '@/features/confirmed/api/keys';
import { DisagreementsView } from '@/features/disagreements/components/disagreements-view';
import { useMembers } from '@/features/members/api/get-members';
import { spectraKeys } from '@/features/spectra/api/keys';
import { CampaignEyebrow } from './campaign-link';
import { WithCampaign } from './with-campaign';

/** Loaded lazily (see router.tsx): it carries the spectrum plot. */
export function CampaignDisagreementsRoute() {
  return <WithCampaign>{(campaign) => <DisagreementsPage campaign={campaign} />}</WithCampaign>;
}

function DisagreementsPage({ campaign }: { campaign: Campaign }) {
  const queryClient = useQueryClient();
  const eyebrow = <CampaignEyebrow campaign={campaign} />;
  const isLead = campaign.myRole === 'lead';
  // Members are listed for every role, but only a lead hands a disagreement on.
  const members = useMembers(campaign.id);
  if (!isLead && campaign.myRole !== 'reader') {
    return (
      <Page title="Disagreements" eyebrow={eyebrow}>
        <Notice tone="warning">Only the campaign's leads, and readers they ask to decide, settle disagreements.</Notice>
      </Page>
    );
  }
  const thirdReaders = isLead ? (members.data?.members ?? []).filter((m) => m.role !== 'observer').map((m) => ({ userId: m.userId, name: m.name })) : null;
  return (
    <Page title="Disagreements" eyebrow={eyebrow} subtitle={isLead ? 'Pairs of readings that did not agree. Your decision is released as the confirmed value, with your reason.' : 'Disagreements a lead asked you to settle as the third reader.'}>
      <DisagreementsView
        campaignId={campaign.id}
        scheme={campaign.gradeScheme}
        thirdReaders={thirdReaders}
        onSettled={() => {
          void queryClient.invalidateQueries({ queryKey: confirmedKeys.campaign(campaign.id) });
          void queryClient.invalidateQueries({ queryKey: spectraKeys.lists(campaign.id) });
        }}
      />
    </Page>
  );
}
