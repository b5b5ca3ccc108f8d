import type { Campaign } from '@contracts/campaigns';
import type { JobProgress } from '@contracts/ingest';
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Page } from '@/components/layout/page';
import { buttonClass } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { Panel } from '@/components/ui/panel';
import { AssignReadersForm } from '@/features/assignments/components/assign-readers-form';
import type { ReaderCandidate } from '@/features/assignments/components/assign-readers-form';
import { inspectKeys } from '@/features/inspect/api/keys';
import { useMembers } from '@/features/members/api/get-members';
import { spectraKeys } from '@/features/spectra/api/keys';
import { targetKeys } from '@/features/targets/api/keys';
import { jobKeys } from '@/features/uploads/api/keys';
import { JobProgressPanel } from '@/features/uploads/components/job-progress-panel';
import { SpectraUploadForm } from '@/features/uploads/components/spectra-upload-form';
import { lastJobOf, rememberLastJob } from '@/features/uploads/hooks/use-last-job';
import { CampaignEyebrow } from './campaign-link';
import { WithCampaign } from './with-campaign';

export function CampaignUploadRoute() {
  return <WithCampaign>{(campaign) => <UploadPage campaign={campaign} />}</WithCampaign>;
}

const jobIdOf = (raw: string | null) => {
  const n = Number(raw);
  return raw && Number.isInteger(n) && n > 0 ? n : null;
};

function UploadPage({ campaign }: { campaign: Campaign }) {
  const [params, setParams] = useSearchParams();
  const queryClient = useQueryClient();
  const jobId = jobIdOf(params.get('job'));
  const lastJob = jobId === null ? lastJobOf(campaign.id) : null;

  const [finished, setFinished] = useState<JobProgress | null>(null);
  // A finished job added spectra and links: the lists elsewhere must not show the old state.
  const onFinished = useCallback(
    (job: JobProgress) => {
      setFinished(job);
      void queryClient.invalidateQueries({ queryKey: spectraKeys.lists(campaign.id) });
      void queryClient.invalidateQueries({ queryKey: targetKeys.lists(campaign.id) });
    },
    [queryClient, campaign.id],
  );

  const links = (
    <div className="flex flex-wrap gap-2">
      <Link to={`/campaigns/${campaign.id}/spectra`} className={buttonClass('secondary', 'sm')}>
        Spectra list
      </Link>
      <Link to={`/campaigns/${campaign.id}/targets`} className={buttonClass('secondary', 'sm')}>
        Targets and catalogue
      </Link>
    </div>
  );

  if (campaign.myRole !== 'lead') {
    return (
      <Page title="Upload spectra" eyebrow={<CampaignEyebrow campaign={campaign} />}>
        <Notice tone="warning">Only the campaign's leads upload spectra. Ask a lead to add yours.</Notice>
        {links}
      </Page>
    );
  }

  return (
    <Page
      title="Upload spectra"
      eyebrow={<CampaignEyebrow campaign={campaign} />}
      subtitle="Every file is kept as sent; the same file sent twice is recognised, not stored twice."
      actions={links}
    >
      <Panel title="Send files">
        {/* The job id goes into the URL, so leaving and coming back shows the same job. */}
        <SpectraUploadForm
          campaignId={campaign.id}
          onUploaded={(id) => {
            rememberLastJob(campaign.id, id);
            setParams({ job: String(id) });
          }}
        />
      </Panel>
      {lastJob ? (
        <p className="text-ink-700">
          <Link to={`?job=${lastJob}`} className="text-blueend-600 underline-offset-2 hover:underline">
            Show job <span className="num">{lastJob}</span>
          </Link>
          , the last upload from this tab.
        </p>
      ) : null}
      {jobId ? (
        <Panel title="Parsing and scanning">
          <JobProgressPanel key={jobId} jobId={jobId} onFinished={onFinished} />
        </Panel>
      ) : null}
      {jobId && finished?.id === jobId && finished.summary.stored > 0 ? (
        <Panel title="Assign the new spectra to readers">
          <AssignNewSpectra
            campaignId={campaign.id}
            onAssigned={() => {
              void queryClient.invalidateQueries({ queryKey: jobKeys.files(jobId) });
              void queryClient.invalidateQueries({ queryKey: spectraKeys.lists(campaign.id) });
              void queryClient.invalidateQueries({ queryKey: inspectKeys.queues() });
            }}
          />
        </Panel>
      ) : null}
    </Page>
  );
}

/** New spectra reach readers' queues only once assigned: the same assignment as the Assign page (every spectrum without readers). */
function AssignNewSpectra({ campaignId, onAssigned }: { campaignId: number; onAssigned: () => void }) {
  const members = useMembers(campaignId);
  if (members.isPending) return <Loading label="Loading members…" />;
  if (members.isError) return <ErrorNotice error={members.error} />;
  const candidates: ReaderCandidate[] = members.data.members.flatMap((m) => (m.role === 'observer' ? [] : [{ userId: m.userId, name: m.name, email: m.email, role: m.role }]));
  return (
    <div className="flex flex-col gap-2">
      <p className="text-ink-700">They are not in anyone's reading queue yet. Choose readers: each spectrum without readers gets two different ones.</p>
      <AssignReadersForm campaignId={campaignId} candidates={candidates} onAssigned={onAssigned} />
    </div>
  );
}
