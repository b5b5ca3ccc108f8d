import type { Campaign } from '@contracts/campaigns';
import { formatDate, formatGridStep, formatRedshiftRange, formatTolerance } from '@/lib/format';

/** The settings every reader needs in view: what range is searched, on which grid, and when two readings agree. */
export function CampaignFacts({ campaign }: { campaign: Campaign }) {
  const facts = [
    { term: 'Redshift range', value: formatRedshiftRange(campaign.zMin, campaign.zMax), mono: true },
    { term: 'Scan grid', value: formatGridStep(campaign.gridStep), mono: false },
    { term: 'Agreement tolerance', value: formatTolerance(campaign.tolerance), mono: true },
    { term: 'Members', value: String(campaign.memberCount), mono: true },
    { term: 'Created', value: formatDate(campaign.createdAt), mono: true },
  ];
  return (
    <div className="flex flex-col gap-3">
      {campaign.description ? (
        <p className="max-w-prose whitespace-pre-line text-md text-ink-800">{campaign.description}</p>
      ) : (
        <p className="text-ink-500">No description.</p>
      )}
      <dl className="grid grid-cols-1 gap-x-6 gap-y-2 min-[480px]:grid-cols-2 md:grid-cols-3 xl:grid-cols-5">
        {facts.map((f) => (
          <div key={f.term} className="flex flex-col">
            <dt className="text-xs font-semibold uppercase tracking-wide text-ink-500">{f.term}</dt>
            <dd className={`text-md whitespace-nowrap text-ink-900 ${f.mono ? 'num' : ''}`}>{f.value}</dd>
          </div>
        ))}
      </dl>
    </div>
  );
}
