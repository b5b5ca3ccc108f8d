import type { Grade } from '@contracts/grades';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { Panel } from '@/components/ui/panel';
import { useAllConfirmed } from '../api/get-all-confirmed';
import { GradeDistribution } from './pictures/grade-distribution';
import { PhotoZScatter } from './pictures/photo-z-scatter';
import { ReaderAgreement } from './pictures/reader-agreement';

/** Pictures of the whole release (not of the filtered page), drawn from the confirmed table itself. */
export function ReleasePictures({ campaignId, scheme }: { campaignId: number; scheme: Grade[] }) {
  const all = useAllConfirmed(campaignId);
  return (
    <Panel title="Pictures of the release">
      {all.isPending ? (
        <Loading label="Loading every confirmed redshift…" />
      ) : all.isError ? (
        <ErrorNotice error={all.error} />
      ) : all.data.length === 0 ? (
        <p className="text-sm text-ink-500">Nothing confirmed yet, so nothing to draw.</p>
      ) : (
        <div className="grid grid-cols-1 gap-5 lg:grid-cols-2">
          {/* The photo-z computed from the catalogue fluxes where there is one, else the catalogue's own. */}
          <PhotoZScatter rows={all.data.map((r) => ({ z: r.z, photoZ: r.zPhot ?? r.photoZ }))} />
          <GradeDistribution rows={all.data} scheme={scheme} />
          <ReaderAgreement campaignId={campaignId} />
        </div>
      )}
    </Panel>
  );
}
