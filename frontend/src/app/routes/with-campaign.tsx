import type { Campaign } from '@contracts/campaigns';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Page } from '@/components/layout/page';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { useCampaign } from '@/features/campaigns/api/get-campaign';
import { useCampaignIdParam } from './campaign-id';
import { NotFoundRoute } from './not-found';

/** Loads the campaign of a campaign sub-page (for its name and the person's role) before rendering it. */
export function WithCampaign({ children }: { children: (campaign: Campaign) => ReactNode }) {
  const id = useCampaignIdParam();
  if (id === null) return <NotFoundRoute />;
  return <CampaignLoader id={id}>{children}</CampaignLoader>;
}

function CampaignLoader({ id, children }: { id: number; children: (campaign: Campaign) => ReactNode }) {
  const campaign = useCampaign(id);
  if (campaign.isPending) return <Loading label="Loading campaign…" />;
  if (campaign.isError) {
    return (
      <Page
        title="Campaign unavailable"
        eyebrow={
          <Link to="/campaigns" className="hover:underline">
            Campaigns
          </Link>
        }
      >
        <ErrorNotice error={campaign.error} />
      </Page>
    );
  }
  return <>{children(campaign.data)}</>;
}
