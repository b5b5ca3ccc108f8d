import { useParams } from 'react-router-dom';
import { Panel } from '@/components/ui/panel';
import { SpectrumAssignments } from '@/features/assignments/components/spectrum-assignments';
import { ReleasedValue } from '@/features/confirmed/components/released-value';
import { SpectrumInspector } from '@/features/inspect/components/spectrum-inspector';
import type { SpectrumDetail } from '@/features/inspect/api/schemas';
import { NotFoundRoute } from './not-found';

/** Loaded lazily (see router.tsx), like the queue's inspection route. */
export function SpectrumRoute() {
  const id = Number(useParams().spectrumId);
  if (!Number.isInteger(id) || id <= 0) return <NotFoundRoute />;
  return <SpectrumInspector key={id} spectrumId={id} aside={releasedValue} />;
}

// The released value belongs to the release feature; the route puts it beside the inspection context.
const releasedValue = (d: SpectrumDetail) => (
  <>
    <Panel title="Confirmed redshift">
      <ReleasedValue spectrumId={d.spectrum.id} isLead={d.campaign.myRole === 'lead'} scheme={d.campaign.gradeScheme} />
    </Panel>
    {d.campaign.myRole === 'lead' ? (
      <Panel title="Readers">
        <SpectrumAssignments spectrumId={d.spectrum.id} />
      </Panel>
    ) : null}
  </>
);
