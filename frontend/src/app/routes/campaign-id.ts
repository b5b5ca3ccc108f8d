import { useParams } from 'react-router-dom';

/** The route's campaign id, or null when the URL holds something that cannot be one. */
export function useCampaignIdParam(): number | null {
  const id = Number(useParams().campaignId);
  return Number.isInteger(id) && id > 0 ? id : null;
}
