import type { Campaign } from '@contracts/campaigns';
import { useQueryClient } from '@tanstack/react-query';
import { Page } from '@/components/layout/page';
import { Panel } from '@/components/ui/panel';
import { spectraKeys } from '@/features/spectra/api/keys';
import { CatalogueImport } from '@/features/targets/components/catalogue-import';
import { TargetsList } from '@/features/targets/components/targets-list';
import { CampaignEyebrow } from './campaign-link';
import { WithCampaign } from './with-campaign';

export function CampaignTargetsRoute() {
  return <WithCampaign>{(campaign) => <TargetsPage campaign={campaign} />}</WithCampaign>;
}

function TargetsPage({ campaign }: { campaign: Campaign }) {
  const queryClient = useQueryClient();
  return (
    <Page title="Targets" eyebrow={<CampaignEyebrow campaign={campaign} />} subtitle="The objects of the campaign's catalogue, with the spectra linked to each.">
      {campaign.myRole === 'lead' ? (
        <Panel title="Import a catalogue">
          {/* An import can link spectra that had no target, so the spectra lists are refreshed. */}
          <CatalogueImport campaignId={campaign.id} onImported={() => void queryClient.invalidateQueries({ queryKey: spectraKeys.lists(campaign.id) })} />
        </Panel>
      ) : null}
      <Panel title="Targets">
        <TargetsList campaignId={campaign.id} />
      </Panel>
    </Page>
  );
}
