import type { Grade } from '@contracts/grades';
import { useMemo } from 'react';
import uPlot from 'uplot';
import { PLOT } from '@/components/spectrum/plot-palette';
import { gradeText } from '@/lib/grade-label';
import { UPlotChart } from './uplot-chart';

const axis = { stroke: PLOT.axis, grid: { stroke: PLOT.grid, width: 1 }, ticks: { stroke: PLOT.grid } };

/** How many released values carry each grade of the campaign's scheme. */
export function GradeDistribution({ rows, scheme }: { rows: ReadonlyArray<{ gradeCode: string }>; scheme: Grade[] }) {
  // Least confident on the left, as the scheme reads from the bottom up.
  const grades = useMemo(() => [...scheme].reverse(), [scheme]);
  const counts = useMemo(() => grades.map((g) => rows.filter((r) => r.gradeCode === g.code).length), [grades, rows]);
  const data = useMemo<uPlot.AlignedData>(() => [grades.map((_, i) => i), counts], [grades, counts]);
  const options = useMemo<Omit<uPlot.Options, 'width'>>(
    () => ({
      height: 220,
      legend: { show: false },
      cursor: { show: false },
      scales: { x: { time: false, range: () => [-0.6, grades.length - 0.4] }, y: { range: (_u, _min, max) => [0, Math.max(1, max) * 1.1] } },
      axes: [
        { ...axis, label: 'Grade (least to most confident)', splits: () => grades.map((_, i) => i), values: (_u, splits) => splits.map((i) => (grades[i] ? grades[i]!.label : '')) },
        { ...axis, label: 'Confirmed redshifts' },
      ],
      series: [{}, { label: 'count', stroke: PLOT.solution, fill: 'rgba(183, 70, 27, 0.35)', paths: uPlot.paths.bars!({ size: [0.6, 60] }), points: { show: false } }],
    }),
    [grades],
  );
  return (
    <figure className="flex flex-col gap-2">
      <UPlotChart options={options} data={data} label="Confirmed redshifts per grade" describedBy="grade-summary" />
      <figcaption id="grade-summary" className="num text-sm text-ink-700">
        {grades.map((g, i) => `${gradeText(scheme, g.code)}: ${counts[i]}`).join(' · ')}
      </figcaption>
    </figure>
  );
}
