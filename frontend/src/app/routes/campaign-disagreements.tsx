import type { Campaign } from '@contracts/campaigns';
import { useQueryClient } from '@tanstack/react-query';
import { Page } from '@/components/layout/page';
import { Notice } from '@/components/ui/notice';
import { confirmedKeys } from '@/features/confirmed/api/keys';
import { DisagreementsView } from '@/features/disagreements/components/disagreements-view';
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
  if (campaign.myRole !== 'lead') {
    return (
      <Page title="Disagreements" eyebrow={eyebrow}>
        <Notice tone="warning">Only the campaign's leads settle disagreements.</Notice>
      </Page>
    );
  }
  return (
    <Page title="Disagreements" eyebrow={eyebrow} subtitle="Pairs of readings that did not agree. Your decision is released as the confirmed value, with your reason.">
      <DisagreementsView
        campaignId={campaign.id}
        scheme={campaign.gradeScheme}
        onSettled={() => {
          void queryClient.invalidateQueries({ queryKey: confirmedKeys.campaign(campaign.id) });
          void queryClient.invalidateQueries({ queryKey: spectraKeys.lists(campaign.id) });
        }}
      />
    </Page>
  );
}
