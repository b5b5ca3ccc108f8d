import { useNavigate } from 'react-router-dom';
import { Page } from '@/components/layout/page';
import { Panel } from '@/components/ui/panel';
import { CampaignList } from '@/features/campaigns/components/campaign-list';
import { CreateCampaignForm } from '@/features/campaigns/components/create-campaign-form';

export function CampaignsRoute() {
  const navigate = useNavigate();
  return (
    <Page title="Campaigns" subtitle="Follow-up programmes you lead, read for or observe.">
      <div className="grid grid-cols-1 items-start gap-5 lg:grid-cols-[1fr_22rem]">
        <div className="min-w-0">
          <CampaignList />
        </div>
        <Panel title="New campaign">
          <p className="mb-3 text-sm text-ink-500">You become its lead and can invite readers and observers.</p>
          <CreateCampaignForm onCreated={(c) => void navigate(`/campaigns/${c.id}`)} />
        </Panel>
      </div>
    </Page>
  );
}
