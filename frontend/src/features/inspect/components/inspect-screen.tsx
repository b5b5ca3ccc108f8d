import { useQueryClient } from '@tanstack/react-query';
import { getCombLinesQueryOptions, measuredZ } from '../api/get-comb-lines';
import { asSpectrumClass } from '@/lib/spectrum-class';
import { useEffect } from 'react';
import type { ReactNode } from 'react';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { useLineList } from '@/lib/line-list';
import { getScanCurvesQueryOptions, useScanCurves } from '../api/get-scan-curves';
import { getSolutionModelQueryOptions } from '../api/get-solution-model';
import { getSpectrumDataQueryOptions, useSpectrumData } from '@/lib/spectrum-data';
import { getSpectrumDetailQueryOptions, useSpectrumDetail } from '../api/get-spectrum-detail';
import type { SpectrumDetail } from '../api/schemas';
import { InspectWorkspace } from './inspect-workspace';
import type { QueueNavigation } from './inspect-workspace';

interface Props {
  spectrumId: number;
  /** Prefetched while the reader works on this one, so moving on is instant. */
  nextId: number | null;
  nav: QueueNavigation;
  header: (detail: SpectrumDetail | undefined) => ReactNode;
  aside?: (detail: SpectrumDetail) => ReactNode;
}

/** Loads what one spectrum needs (detail, arrays, χ² curves, line list) and opens the workspace. */
export function InspectScreen({ spectrumId, nextId, nav, header, aside }: Props) {
  const detail = useSpectrumDetail(spectrumId);
  const data = useSpectrumData(spectrumId);
  const curves = useScanCurves(spectrumId);
  const lines = useLineList();
  usePrefetchSpectrum(nextId);

  const failed = detail.error ?? data.error ?? lines.error;
  if (failed) {
    return (
      <div className="mx-auto flex w-full max-w-[1680px] flex-col gap-3 px-4 py-4">
        {header(detail.data)}
        <ErrorNotice error={failed} title="This spectrum cannot be shown" />
      </div>
    );
  }
  if (!detail.data || !data.data || !lines.data) {
    return (
      <div className="mx-auto flex w-full max-w-[1680px] flex-col gap-3 px-4 py-4">
        {header(detail.data)}
        <Loading label="Loading the spectrum…" />
      </div>
    );
  }
  return <InspectWorkspace nextId={nextId} detail={detail.data} arrays={data.data} curves={curves.data} lines={lines.data} nav={nav} header={header(detail.data)} aside={aside?.(detail.data)} />;
}

function usePrefetchSpectrum(spectrumId: number | null) {
  const queryClient = useQueryClient();
  useEffect(() => {
    if (spectrumId === null) return;
    void queryClient.prefetchQuery(getSpectrumDataQueryOptions(spectrumId));
    void queryClient.prefetchQuery(getScanCurvesQueryOptions(spectrumId));
    // The comb opens on the top solution, whose template is drawn: fetch it ahead too, once the
    // detail has said which scan it belongs to.
    // The lines measured at that z are fetched ahead as well: "take the top solution" then ticks them at once.
    void queryClient.fetchQuery(getSpectrumDetailQueryOptions(spectrumId)).then(
      (detail) => {
        const top = detail.scan?.solutions[0];
        const mine = detail.readings[0];
        const z = mine?.z ?? top?.z;
        const cls = mine?.class ?? top?.class;
        if (z !== undefined && cls !== undefined) void queryClient.prefetchQuery(getCombLinesQueryOptions(spectrumId, measuredZ(z, detail.scan?.solutions ?? []), asSpectrumClass(cls)));
        return detail.scan ? queryClient.prefetchQuery(getSolutionModelQueryOptions(spectrumId, detail.scan.id, 1)) : undefined;
      },
      () => undefined,
    );
  }, [queryClient, spectrumId]);
}
