import { useQueryClient } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import type { Campaign } from '@contracts/campaigns';
import { Page } from '@/components/layout/page';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { buttonClass } from '@/components/ui/button';
import { Panel } from '@/components/ui/panel';
import { RoleBadge } from '@/components/ui/role-badge';
import { useCampaign } from '@/features/campaigns/api/get-campaign';
import { CampaignFacts } from '@/features/campaigns/components/campaign-facts';
import { CampaignSettingsForm } from '@/features/campaigns/components/campaign-settings-form';
import { GradeSchemeTable } from '@/features/campaigns/components/grade-scheme-table';
import { CampaignMembers } from '@/features/members/components/campaign-members';
import { getScanStatusQueryOptions } from '@/features/spectra/api/scan-status';
import { RescanNotice } from '@/features/spectra/components/rescan-notice';
import { SpectraCounts } from '@/features/spectra/components/spectra-counts';
import { NotFoundRoute } from './not-found';
import { ReleasePanel } from './release-links';

const backLink = (
  <Link to="/campaigns" className="hover:underline">
    Campaigns
  </Link>
);

export function CampaignRoute() {
  const id = Number(useParams().campaignId);
  if (!Number.isInteger(id) || id <= 0) return <NotFoundRoute />;
  return <CampaignOverview id={id} />;
}

function CampaignOverview({ id }: { id: number }) {
  const campaign = useCampaign(id);
  const queryClient = useQueryClient();

  if (campaign.isPending) return <Loading label="Loading campaign…" />;
  if (campaign.isError) {
    return (
      <Page title="Campaign unavailable" eyebrow={backLink}>
        <ErrorNotice error={campaign.error} />
      </Page>
    );
  }

  const c = campaign.data;
  const isLead = c.myRole === 'lead';
  return (
    <Page title={c.name} eyebrow={backLink} actions={c.myRole ? <RoleBadge role={c.myRole} /> : null}>
      <Panel>
        <CampaignFacts campaign={c} />
      </Panel>
      <RescanNotice campaignId={c.id} isLead={isLead} />
      <DataPanel campaign={c} isLead={isLead} />
      <ReleasePanel campaign={c} />
      <Panel>
        <CampaignMembers campaignId={c.id} isLead={isLead} />
      </Panel>
      <Panel>
        <GradeSchemeTable scheme={c.gradeScheme} />
      </Panel>
      {isLead ? (
        <Panel title="Settings">
          {/* A new range or grid makes scans out of date: the re-scan notice above asks again at once. */}
          <CampaignSettingsForm key={c.id} campaign={c} onSaved={() => queryClient.invalidateQueries({ queryKey: getScanStatusQueryOptions(c.id).queryKey })} />
        </Panel>
      ) : null}
    </Page>
  );
}

/** Where the spectra and targets live; kept small so the overview stays an overview. */
function DataPanel({ campaign, isLead }: { campaign: Campaign; isLead: boolean }) {
  const base = `/campaigns/${campaign.id}`;
  return (
    <Panel title="Data">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <SpectraCounts campaignId={campaign.id} />
        <nav aria-label="Campaign data" className="flex flex-wrap gap-2">
          {campaign.myRole === 'reader' || isLead ? (
            <Link to={`${base}/inspect`} className={buttonClass(isLead ? 'secondary' : 'primary', 'sm')}>
              Start reading
            </Link>
          ) : null}
          <Link to={`${base}/spectra`} className={buttonClass('secondary', 'sm')}>
            Spectra list
          </Link>
          <Link to={`${base}/targets`} className={buttonClass('secondary', 'sm')}>
            {isLead ? 'Targets and catalogue import' : 'Targets'}
          </Link>
          {isLead ? (
            <Link to={`${base}/upload`} className={buttonClass('primary', 'sm')}>
              Upload spectra
            </Link>
          ) : null}
        </nav>
      </div>
    </Panel>
  );
}
