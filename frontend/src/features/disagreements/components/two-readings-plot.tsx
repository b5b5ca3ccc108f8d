import type { Reading } from '@contracts/readings';
import { useMemo, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { PLOT } from '@/components/spectrum/plot-palette';
import { SpectrumPlot } from '@/components/spectrum/spectrum-plot';
import type { PlotControls } from '@/components/spectrum/spectrum-plot';
import { createTrialZStore } from '@/components/spectrum/trial-z-store';
import { readingCombLines } from '@/components/spectrum/comb-lines';
import { defaultSmoothing, spectrumSnr } from '@/components/spectrum/default-smoothing';
import { useDisplayArrays } from '@/components/spectrum/use-display-arrays';
import type { SpectrumArrays } from '@/lib/decode-spectrum-data';
import { formatRedshift } from '@/lib/format';
import type { CombLine } from '@/lib/line-list';


/**
 * The spectrum with both readings' combs at once, each drawing only the lines its reader used (or
 * its class's lines when the reading names none): the first reading's labels run in one row along
 * the top, the second's in one row along the bottom, each row captioned with its reader's z and
 * each comb in its own colour. Labels with no room are listed on hover. Neither comb moves;
 * dragging zooms.
 */
export function TwoReadingsPlot({ arrays, lines, first, second }: { arrays: SpectrumArrays; lines: CombLine[]; first: Reading; second: Reading }) {
  // Smoothed as the inspection screen opens it: matched to the S/N below 3 per pixel, else not at all.
  const smoothing = useMemo(() => defaultSmoothing(spectrumSnr(arrays)), [arrays]);
  const display = useDisplayArrays(arrays, smoothing);
  const controls = useRef<PlotControls>(null);
  // Stores are per pair of readings; the page mounts this per disagreement.
  const [stores] = useState(() => [createTrialZStore(first.z, -0.01, 12), createTrialZStore(second.z, -0.01, 12)] as const);
  const combs = useMemo(
    () => [
      { store: stores[0], lines: readingCombLines(lines, first.lines, first.class), look: { colour: PLOT.readingFirst, labels: 'top' as const, rows: 1, caption: `1st z = ${formatRedshift(first.z)}` } },
      { store: stores[1], lines: readingCombLines(lines, second.lines, second.class), look: { colour: PLOT.readingSecond, labels: 'bottom' as const, rows: 1, caption: `2nd z = ${formatRedshift(second.z)}` } },
    ],
    [stores, lines, first, second],
  );
  const description = useMemo(
    () =>
      `The first reading's comb is drawn at z = ${formatRedshift(first.z)} with the lines it used (${first.lines.length > 0 ? first.lines.join(', ') : `none named; its class's lines`}) named along the top; the second reading's at z = ${formatRedshift(second.z)} with its lines (${second.lines.length > 0 ? second.lines.join(', ') : `none named; its class's lines`}) along the bottom. Drag across the plot to zoom in.`,
    [first, second],
  );

  return (
    <div className="flex flex-col gap-2">
      <p id="two-combs-help" className="sr-only">
        {description}
      </p>
      <SpectrumPlot display={display} lines={lines} combs={combs} tool="zoom" restFrame={false} controls={controls} describedBy="two-combs-help" label="Spectrum with both readings' combs" />
      <div className="flex flex-wrap items-center justify-between gap-2">
        <ul aria-label="Combs" className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-600">
          <CombKey colour={PLOT.readingFirst} text={`first reading, z = ${formatRedshift(first.z)} (its lines, names on top)`} />
          <CombKey colour={PLOT.readingSecond} text={`second reading, z = ${formatRedshift(second.z)} (its lines, names below)`} />
          <li>solid emission · dashed absorption · dotted band or break{smoothing.kind === 'none' ? '' : ` · flux smoothed: boxcar ${smoothing.width} px (S/N below 3 per pixel)`}</li>
        </ul>
        <Button variant="secondary" size="sm" onClick={() => controls.current?.resetZoom()}>
          Reset zoom
        </Button>
      </div>
    </div>
  );
}

function CombKey({ colour, text }: { colour: string; text: string }) {
  return (
    <li className="inline-flex items-center gap-1.5">
      <span aria-hidden="true" className="inline-block h-3 w-0.5" style={{ backgroundColor: colour }} />
      <span className="num">{text}</span>
    </li>
  );
}
