import type { Campaign } from '@contracts/campaigns';
import { Link } from 'react-router-dom';
import { Page } from '@/components/layout/page';
import { buttonClass } from '@/components/ui/button';
import { ConfirmedBrowser } from '@/features/confirmed/components/confirmed-browser';
import { ReleasePictures } from '@/features/confirmed/components/release-pictures';
import { CampaignEyebrow } from './campaign-link';
import { WithCampaign } from './with-campaign';

/** Loaded lazily (see router.tsx). Every member, observers included, may read and download it. */
export function CampaignConfirmedRoute() {
  return <WithCampaign>{(campaign) => <ConfirmedPage campaign={campaign} />}</WithCampaign>;
}

function ConfirmedPage({ campaign }: { campaign: Campaign }) {
  return (
    <Page
      title="Confirmed redshifts"
      eyebrow={<CampaignEyebrow campaign={campaign} />}
      subtitle="The released value of each spectrum. A correction adds a new record; earlier values stay in the spectrum's history."
      actions={
        <Link to={`/campaigns/${campaign.id}/families`} className={buttonClass('secondary', 'sm')}>
          Image families
        </Link>
      }
    >
      <ConfirmedBrowser campaignId={campaign.id} scheme={campaign.gradeScheme} />
      <ReleasePictures campaignId={campaign.id} scheme={campaign.gradeScheme} />
    </Page>
  );
}
