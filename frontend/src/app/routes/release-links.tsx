import type { Campaign } from '@contracts/campaigns';
import { Link } from 'react-router-dom';
import { buttonClass } from '@/components/ui/button';
import { Panel } from '@/components/ui/panel';
import { useSpectrumStates } from '@/features/confirmed/api/get-confirmed';
import { StateCounts } from '@/features/confirmed/components/state-counts';
import { useDisagreements } from '@/features/disagreements/api/get-disagreements';

/** The campaign overview's way into second reading and release; the open count tells a lead what waits. */
export function ReleasePanel({ campaign }: { campaign: Campaign }) {
  const isLead = campaign.myRole === 'lead';
  const open = useDisagreements(campaign.id, isLead);
  const states = useSpectrumStates(campaign.id);
  const base = `/campaigns/${campaign.id}`;
  const count = open.data?.length;

  return (
    <Panel title="Second reading and release">
      <div className="flex flex-col gap-4">
        {states.data ? <StateCounts states={states.data} /> : null}
        <nav aria-label="Release" className="flex flex-wrap gap-2">
          {isLead ? (
            <>
              <Link to={`${base}/assign`} className={buttonClass('secondary', 'sm')}>
                Assign readers
              </Link>
              <Link to={`${base}/disagreements`} className={buttonClass(count ? 'primary' : 'secondary', 'sm')}>
                Disagreements{count === undefined ? '' : ` (${count} open)`}
              </Link>
            </>
          ) : null}
          <Link to={`${base}/confirmed`} className={buttonClass('secondary', 'sm')}>
            Confirmed redshifts
          </Link>
          <Link to={`${base}/families`} className={buttonClass('secondary', 'sm')}>
            Image families
          </Link>
        </nav>
      </div>
    </Panel>
  );
}
