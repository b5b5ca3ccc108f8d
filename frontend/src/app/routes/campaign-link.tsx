import type { Campaign } from '@contracts/campaigns';
import { Link } from 'react-router-dom';

/** The eyebrow of a campaign's sub-pages: back to the campaign, by name. */
export function CampaignEyebrow({ campaign }: { campaign: Pick<Campaign, 'id' | 'name'> }) {
  return (
    <span>
      <Link to="/campaigns" className="hover:underline">
        Campaigns
      </Link>
      <span aria-hidden="true"> / </span>
      <Link to={`/campaigns/${campaign.id}`} className="hover:underline">
        {campaign.name}
      </Link>
    </span>
  );
}
