import { QueueInspector } from '@/features/inspect/components/queue-inspector';
import { WithCampaign } from './with-campaign';

/** Loaded lazily (see router.tsx): the inspection screen carries uPlot, which no other page needs. */
export function CampaignInspectRoute() {
  return <WithCampaign>{(campaign) => <QueueInspector campaign={campaign} />}</WithCampaign>;
}
