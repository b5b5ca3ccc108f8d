import type { CampaignProgress } from '@contracts/campaigns';
import { Link } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { RoleBadge } from '@/components/ui/role-badge';
import { Table, tdClass, thClass } from '@/components/ui/table';
import { formatCount, formatDate, formatRedshiftRange, formatTolerance } from '@/lib/format';
import { useCampaigns } from '../api/get-campaigns';

/** Spectra unread, agreed and confirmed (a reader is not told how many agreed: readings are blind). */
function Progress({ progress: p }: { progress: CampaignProgress }) {
  if (p.spectra === 0) return <span className="text-sm text-ink-500">no spectra yet</span>;
  const parts = [`${formatCount(p.unread)} unread`, ...(p.agreed === null ? [] : [`${formatCount(p.agreed)} agreed`]), `${formatCount(p.confirmed)} confirmed`];
  return (
    <span className="num whitespace-nowrap text-sm">
      {parts.join(' · ')}
      <span className="block text-xs text-ink-500">
        of {formatCount(p.spectra)} spectra
        {p.openDisagreements ? ` · ${formatCount(p.openDisagreements)} to settle` : ''}
      </span>
    </span>
  );
}

export function CampaignList() {
  const campaigns = useCampaigns();

  if (campaigns.isPending) return <Loading label="Loading campaigns…" />;
  if (campaigns.isError) return <ErrorNotice error={campaigns.error} title="Campaigns could not be loaded" />;
  if (campaigns.data.length === 0) {
    return (
      <EmptyState title="No campaigns yet — create one with the form on this page.">
        Or ask a campaign lead to invite you; invitations arrive by e-mail.
      </EmptyState>
    );
  }

  return (
    <Table caption="Your campaigns" captionHidden>
      <thead>
        <tr>
          <th className={thClass}>Campaign</th>
          <th className={thClass}>Your role</th>
          <th className={thClass}>Progress</th>
          <th className={thClass}>Redshift range</th>
          <th className={thClass}>Agreement tolerance</th>
          <th className={`${thClass} text-right`}>Members</th>
          <th className={thClass}>Updated</th>
        </tr>
      </thead>
      <tbody>
        {campaigns.data.map((c) => (
          <tr key={c.id} className="hover:bg-paper-100">
            <td className={tdClass}>
              {/* The link's name is exactly the campaign name, so it reads well in a links list. */}
              <Link to={`/campaigns/${c.id}`} className="font-medium text-blueend-700 underline-offset-2 hover:underline">
                {c.name}
              </Link>
              {c.description ? <p className="line-clamp-1 max-w-md text-sm text-ink-500">{c.description}</p> : null}
            </td>
            <td className={tdClass}>{c.myRole ? <RoleBadge role={c.myRole} /> : <span className="text-ink-500">not a member</span>}</td>
            <td className={tdClass}>
              <Progress progress={c.progress} />
            </td>
            <td className={`${tdClass} num whitespace-nowrap`}>{formatRedshiftRange(c.zMin, c.zMax)}</td>
            <td className={`${tdClass} num whitespace-nowrap`}>{formatTolerance(c.tolerance)}</td>
            <td className={`${tdClass} num text-right`}>{c.memberCount}</td>
            <td className={`${tdClass} num whitespace-nowrap text-ink-600`}>{formatDate(c.updatedAt)}</td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
