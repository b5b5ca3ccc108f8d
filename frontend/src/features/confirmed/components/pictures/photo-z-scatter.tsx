import { useMemo } from 'react';
import type uPlot from 'uplot';
import { PLOT } from '@/components/spectrum/plot-palette';
import { comparePhotoZ, OUTLIER_CUT } from './photo-z-outliers';
import { UPlotChart } from './uplot-chart';

const noPath = () => null;
const axis = { stroke: PLOT.axis, grid: { stroke: PLOT.grid, width: 1 }, ticks: { stroke: PLOT.grid } };

/** Spectroscopic against photometric redshift, the outliers in ember and counted in words beside the plot. */
export function PhotoZScatter({ rows }: { rows: ReadonlyArray<{ z: number; photoZ: number | null }> }) {
  const c = useMemo(() => comparePhotoZ(rows), [rows]);
  const data = useMemo<uPlot.AlignedData>(() => [c.photoZ, c.photoZ, c.inlier, c.outlier], [c]);
  const options = useMemo<Omit<uPlot.Options, 'width'>>(() => {
    let top = 0.5;
    for (let i = 0; i < c.compared; i++) top = Math.max(top, c.photoZ[i]!, Number.isNaN(c.inlier[i]!) ? c.outlier[i]! : c.inlier[i]!);
    const range: uPlot.Range.MinMax = [0, Math.ceil(top * 1.05 * 2) / 2];
    return {
      height: 300,
      legend: { show: false },
      cursor: { show: false },
      scales: { x: { time: false, range: () => range }, y: { range: () => range } },
      axes: [
        { ...axis, label: 'Photometric z' },
        { ...axis, label: 'Confirmed z' },
      ],
      series: [
        {},
        { label: 'z = photo-z', stroke: PLOT.reference, width: 1, points: { show: false } },
        { label: 'within the cut', stroke: PLOT.flux, paths: noPath, points: { show: true, size: 6, fill: PLOT.flux } },
        { label: 'outlier', stroke: PLOT.emission, paths: noPath, points: { show: true, size: 8, fill: PLOT.emission } },
      ],
    };
  }, [c]);

  if (c.compared === 0) return <p className="text-sm text-ink-500">No confirmed target has a photometric redshift to compare with.</p>;
  const fraction = ((100 * c.outliers) / c.compared).toFixed(1);
  return (
    <figure className="flex flex-col gap-2">
      <UPlotChart options={options} data={data} label="Confirmed redshift against photometric redshift" describedBy="photoz-summary" />
      <figcaption id="photoz-summary" className="text-sm text-ink-700">
        <span className="num">{c.outliers}</span> of <span className="num">{c.compared}</span> confirmed targets with a photo-z are outliers (<span className="num">{fraction} %</span>), counting
        |z − photo-z|/(1 + z) &gt; <span className="num">{OUTLIER_CUT}</span>, the threshold commonly used to judge photometric redshifts. Outliers are drawn in ember, the others in ink; the grey
        line is z = photo-z.
      </figcaption>
    </figure>
  );
}
