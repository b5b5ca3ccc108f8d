import type { Campaign } from '@contracts/campaigns';
import { Link } from 'react-router-dom';
import { Page } from '@/components/layout/page';
import { buttonClass } from '@/components/ui/button';
import { FamiliesView } from '@/features/confirmed/components/families-view';
import { CampaignEyebrow } from './campaign-link';
import { WithCampaign } from './with-campaign';

/** Loaded lazily (see router.tsx). */
export function CampaignFamiliesRoute() {
  return <WithCampaign>{(campaign) => <FamiliesPage campaign={campaign} />}</WithCampaign>;
}

function FamiliesPage({ campaign }: { campaign: Campaign }) {
  return (
    <Page
      title="Image families"
      eyebrow={<CampaignEyebrow campaign={campaign} />}
      subtitle="Multiple images of one lensed source must share a redshift. Each family lists its images' confirmed values and the spread between them."
      actions={
        <Link to={`/campaigns/${campaign.id}/confirmed`} className={buttonClass('secondary', 'sm')}>
          Confirmed redshifts
        </Link>
      }
    >
      <FamiliesView campaignId={campaign.id} />
    </Page>
  );
}
