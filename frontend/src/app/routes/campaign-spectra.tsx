import type { Campaign } from '@contracts/campaigns';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { Page } from '@/components/layout/page';
import { buttonClass } from '@/components/ui/button';
import { Panel } from '@/components/ui/panel';
import { SpectraBrowser } from '@/features/spectra/components/spectra-browser';
import { getTargetsQueryOptions } from '@/features/targets/api/get-targets';
import { targetKeys } from '@/features/targets/api/keys';
import { CampaignEyebrow } from './campaign-link';
import { WithCampaign } from './with-campaign';

export function CampaignSpectraRoute() {
  return <WithCampaign>{(campaign) => <SpectraPage campaign={campaign} />}</WithCampaign>;
}

function SpectraPage({ campaign }: { campaign: Campaign }) {
  const isLead = campaign.myRole === 'lead';
  const queryClient = useQueryClient();
  // Leads link unlinked spectra by hand; the choices are the campaign's targets.
  const targets = useQuery({ ...getTargetsQueryOptions(campaign.id), enabled: isLead });
  const linkOptions = useMemo(() => (isLead ? targets.data?.map((t) => ({ id: t.id, catalogueId: t.catalogueId })) : undefined), [isLead, targets.data]);
  const upload = `/campaigns/${campaign.id}/upload`;

  return (
    <Page
      title="Spectra"
      eyebrow={<CampaignEyebrow campaign={campaign} />}
      actions={
        isLead ? (
          <Link to={upload} className={buttonClass('primary', 'sm')}>
            Upload spectra
          </Link>
        ) : null
      }
    >
      <Panel>
        <SpectraBrowser
          campaignId={campaign.id}
          linkOptions={linkOptions}
          onLinked={() => void queryClient.invalidateQueries({ queryKey: targetKeys.lists(campaign.id) })}
          emptyHint={
            isLead ? (
              <Link to={upload} className="text-blueend-600 hover:underline">
                Upload spectra
              </Link>
            ) : (
              'A lead of the campaign uploads them.'
            )
          }
        />
      </Panel>
    </Page>
  );
}
