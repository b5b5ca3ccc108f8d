import type { Reading } from '@contracts/readings';
import { useMemo, useRef, useState } from 'react';
import type { ReactNode } from 'react';
import { Notice } from '@/components/ui/notice';
import { Panel } from '@/components/ui/panel';
import type { CombLine, SpectrumDetail } from '../api/schemas';
import { PLOT } from '@/components/spectrum/plot-palette';
import { displayArraysOf, useDisplayArrays } from '@/components/spectrum/use-display-arrays';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { getCombLinesQueryOptions, measuredZ } from '../api/get-comb-lines';
import { getSpectrumDataQueryOptions } from '@/lib/spectrum-data';
import { getSolutionModelQueryOptions, useSolutionModel } from '../api/get-solution-model';
import { getSpectrumDetailQueryOptions } from '../api/get-spectrum-detail';
import { useInspectKeys } from '../hooks/use-inspect-keys';
import { linesUsed, useReadingDraft } from '../hooks/use-reading-draft';
import { useSaveReading } from '../hooks/use-save-reading';
import { usePerSpectrum } from '../hooks/use-per-spectrum';
import type { Chi2StripData } from '../utils/chi2-strip-data';
import { nudgeZ, pixelStepFactor } from '@/components/spectrum/comb';
import type { SpectrumArrays } from '@/lib/decode-spectrum-data';
import type { Smoothing } from '@/components/spectrum/smooth';
import { combLinesFor } from '@/components/spectrum/comb-lines';
import { defaultSmoothing, spectrumSnr } from '@/components/spectrum/default-smoothing';
import { skySwampsData } from '@/components/spectrum/sky-default';
import { createTrialZStore } from '@/components/spectrum/trial-z-store';
import { Chi2Strip } from './chi2-strip';
import { usePhotoZPosterior } from '../api/get-photo-z-posterior';
import { usePhotoZLayer } from './photo-z-layer';
import { PhotoZNotice } from './photo-z-notice';
import { asSpectrumClass } from '@/lib/spectrum-class';
import { ContextPanel } from './context-panel';
import { FeaturePanels } from './feature-panels';
import { KeyHelp } from './key-help';
import { PeaksPanel } from './peaks-panel';
import { PlotToolbar } from './plot-toolbar';
import { ReadingForm } from './reading-form';
import { SolutionsList } from './solutions-list';
import { SpectrumPlot } from '@/components/spectrum/spectrum-plot';
import type { PlotControls, PlotTool } from '@/components/spectrum/spectrum-plot';
import { gradeForKey } from '@/lib/grade-label';
import { TrialZInput } from './trial-z-input';

/**
 * Each panel paints on its own (a stacking context): while the comb is dragged, a panel whose
 * content did not change is not repainted because its neighbour's did.
 */
const OWN_PAINT = 'isolate';

export interface QueueNavigation {
  /** e.g. "3 of 60 in your queue". */
  position: ReactNode;
  onNext: (() => void) | null;
  onPrevious: (() => void) | null;
  onSaved: (reading: Reading, detail: SpectrumDetail) => void;
}

interface Props {
  detail: SpectrumDetail;
  /** The spectrum after this one (prefetched by the screen): the plot prepares it ahead. */
  nextId?: number | null;
  arrays: SpectrumArrays;
  curves: Chi2StripData | undefined;
  lines: CombLine[];
  nav: QueueNavigation;
  header: ReactNode;
  /** Extra context from other features, composed by the route (e.g. the confirmed value and its history). */
  aside?: ReactNode;
}

/**
 * One spectrum on the bench: plot and comb, solutions, close-ups, the reading and the context.
 * Mounted once and kept from one spectrum to the next: the plots keep their canvases and the
 * reader's view settings (tool, smoothing, frame, template) carry over, while the comb, the draft
 * reading and a picked peak start afresh with each spectrum (usePerSpectrum).
 */
export function InspectWorkspace({ detail, nextId = null, arrays, curves, lines, nav, header, aside }: Props) {
  const { campaign, scan } = detail;
  const spectrumId = detail.spectrum.id;
  const solutions = useMemo(() => scan?.solutions ?? [], [scan]);
  const mine = detail.readings[0];
  const top = solutions[0];
  const [store] = usePerSpectrum(spectrumId, () => createTrialZStore(mine?.z ?? top?.z ?? Math.max(0, campaign.zMin), Math.max(-0.01, campaign.zMin - 0.01), campaign.zMax));
  const combs = useMemo(() => [{ store }], [store]);
  const [draft, setDraft] = useReadingDraft(spectrumId, mine, asSpectrumClass(mine?.class ?? top?.class ?? scan?.class));
  const [tool, setTool] = useState<PlotTool>('comb');
  // Null: the S/N-matched default of each spectrum (default-smoothing.ts); a reader's choice carries over.
  const [smoothingChoice, setSmoothingChoice] = useState<Smoothing | null>(null);
  const snr = useMemo(() => spectrumSnr(arrays), [arrays]);
  const smoothing = useMemo(() => smoothingChoice ?? defaultSmoothing(snr), [smoothingChoice, snr]);
  const lastSmoothing = useRef<Smoothing>({ kind: 'boxcar', width: 5, unit: 'pixels' });
  // Sky starts hidden when it swamps the data (sky-default.ts), per spectrum; one click shows it.
  const skySwamps = useMemo(() => skySwampsData(arrays.flux, arrays.sky, arrays.mask), [arrays]);
  const [showSky, setShowSky] = usePerSpectrum(spectrumId, () => !skySwamps);
  const [allLines, setAllLines] = useState(false);
  const [restFrame, setRestFrame] = useState(false);
  const [helpOpen, setHelpOpen] = useState(false);
  const [pickedPeak, setPickedPeak] = usePerSpectrum<number | null>(spectrumId, () => null);
  const controls = useRef<PlotControls>(null);
  const zInput = useRef<HTMLInputElement>(null);
  const noteRef = useRef<HTMLTextAreaElement>(null);
  // The template of the solution last snapped to (the top one at first) is drawn over the data.
  const [modelRank, setModelRank] = usePerSpectrum<number | null>(spectrumId, () => (solutions.length > 0 ? 1 : null));
  const [showModel, setShowModel] = useState(true);
  const model = useSolutionModel(spectrumId, scan?.id ?? null, showModel ? modelRank : null);
  const display = useDisplayArrays(arrays, smoothing, showModel ? (model.data ?? null) : null);
  const upcoming = useUpcomingDisplay(nextId, smoothingChoice, showModel);
  // The comb draws the lines of the class being read (the snapped solution's, or the reader's
  // choice) unless all are asked for; the snapped solution's own lines keep their labels first.
  const modelSolution = modelRank !== null ? solutions[modelRank - 1] : undefined;
  const shownSolution = modelSolution && modelSolution.class === draft.cls ? modelSolution : undefined;
  const combLines = useMemo(
    () => combLinesFor(lines, { cls: draft.cls, all: allLines, template: shownSolution?.template ?? null, supporting: shownSolution?.lines.map((l) => l.name) ?? [] }),
    [lines, draft.cls, allLines, shownSolution],
  );
  const photoZFit = detail.target?.photoZFit ?? null;
  const posterior = usePhotoZPosterior(campaign.id, detail.target?.id ?? null, photoZFit !== null);
  const drawPhotoZ = usePhotoZLayer(photoZFit ? posterior.data : null, photoZFit?.z95 ?? null);
  const canRead = detail.assignment !== null && (campaign.myRole === 'reader' || campaign.myRole === 'lead');

  const queryClient = useQueryClient();
  const stepFactor = pixelStepFactor(scan?.meta.step ?? null, arrays.wavelength);

  const { save, pending, error } = useSaveReading({
    spectrumId,
    campaignId: campaign.id,
    store,
    solutions,
    // The detected lines at the comb's z, from the query cache when the form has shown them (the usual case).
    lines: async () => {
      const measured = await queryClient.fetchQuery(getCombLinesQueryOptions(spectrumId, measuredZ(store.get(), solutions), draft.cls));
      return linesUsed(measured.lines.filter((m) => m.detected).map((m) => m.name), draft);
    },
    onSaved: (reading) => nav.onSaved(reading, detail),
  });

  const snap = (i: number) => {
    const s = solutions[i];
    if (!s) return;
    store.set(s.z);
    setModelRank(i + 1);
    setDraft((d) => ({ ...d, cls: asSpectrumClass(s.class), excluded: new Set(), added: new Set() }));
  };
  const setSmoothingKind = (s: Smoothing) => {
    if (s.kind !== 'none') lastSmoothing.current = s;
    setSmoothingChoice(s);
  };

  useInspectKeys(
    {
      nudge: (px) => store.set(nudgeZ(store.get(), stepFactor, px)),
      focusZ: () => zInput.current?.select(),
      takeTop: () => snap(0),
      stepSolution: (delta) => {
        if (solutions.length === 0) return;
        const current = solutions.findIndex((s) => s.z === store.get());
        const from = current >= 0 ? current : delta > 0 ? -1 : 0;
        snap((from + delta + solutions.length) % solutions.length);
      },
      setGrade: (digit) => {
        const code = gradeForKey(campaign.gradeScheme, digit);
        if (canRead && code !== null) setDraft((d) => ({ ...d, grade: code }));
      },
      gradeAndSave: (digit) => {
        const code = gradeForKey(campaign.gradeScheme, digit);
        if (!canRead || code === null) return;
        setDraft((d) => ({ ...d, grade: code }));
        save({ ...draft, grade: code }, code);
      },
      save: () => canRead && save(draft),
      setClass: (cls) => canRead && setDraft((d) => ({ ...d, cls })),
      focusNote: () => noteRef.current?.focus(),
      nextSpectrum: () => nav.onNext?.(),
      previousSpectrum: () => nav.onPrevious?.(),
      toggleSmoothing: () => setSmoothingChoice(smoothing.kind === 'none' ? lastSmoothing.current : { ...smoothing, kind: 'none' }),
      toggleFrame: () => setRestFrame((r) => !r),
      zoom: (f) => controls.current?.zoomBy(f),
      pan: (f) => controls.current?.panBy(f),
      resetZoom: () => controls.current?.resetZoom(),
      toggleTool: () => setTool((t) => (t === 'comb' ? 'zoom' : 'comb')),
      toggleHelp: () => setHelpOpen((o) => !o),
    },
    !helpOpen,
  );

  return (
    <div className="mx-auto flex w-full max-w-[1680px] flex-col gap-3 px-4 py-4">
      {header}
      <div className="flex flex-wrap items-center justify-between gap-2 text-sm text-ink-600">
        <span>{nav.position}</span>
        <span className="flex items-center gap-2">
          <button type="button" className="rounded-control border border-paper-300 bg-paper-50 px-2 py-0.5 hover:bg-paper-200 disabled:opacity-50" disabled={!nav.onPrevious} onClick={() => nav.onPrevious?.()}>
            Previous spectrum
          </button>
          <button type="button" className="rounded-control border border-paper-300 bg-paper-50 px-2 py-0.5 hover:bg-paper-200 disabled:opacity-50" disabled={!nav.onNext} onClick={() => nav.onNext?.()}>
            Next spectrum
          </button>
          <button type="button" className="rounded-control border border-paper-300 bg-paper-50 px-2 py-0.5 hover:bg-paper-200" onClick={() => setHelpOpen(true)} aria-keyshortcuts="?">
            Keys <kbd className="num text-xs text-ink-500">?</kbd>
          </button>
        </span>
      </div>

      <div className="grid gap-4 xl:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="flex min-w-0 flex-col gap-3">
          <section aria-label="Spectrum and comb" className={`flex flex-col gap-2 rounded-panel border border-paper-300 bg-paper-50 p-3 ${OWN_PAINT}`}>
            <div className={`flex flex-wrap items-end gap-x-5 gap-y-2 ${OWN_PAINT}`}>
              <TrialZInput ref={zInput} store={store} />
              <PlotToolbar
                tool={tool}
                onTool={setTool}
                smoothing={smoothing}
                onSmoothing={setSmoothingKind}
                smoothingDefault={{ snr, active: smoothingChoice === null, onRestore: () => setSmoothingChoice(null) }}
                wavelength={arrays.wavelength}
                restFrame={restFrame}
                onRestFrame={setRestFrame}
                lineSet={{ cls: draft.cls, all: allLines, onAll: setAllLines }}
                sky={arrays.sky ? { shown: showSky, swamps: skySwamps, onShown: setShowSky } : null}
                controls={controls}
              />
            </div>
            <p id="plot-help" className="sr-only">
              Arrow keys nudge the comb by one pixel in velocity, with Shift by ten. Plus and minus zoom, comma and full stop pan, r resets the zoom. Press question mark for all keys.
            </p>
            <SpectrumPlot
              display={display}
              upcoming={upcoming}
              lines={combLines}
              showSky={showSky}
              peaks={scan?.lineMatches.peaks ?? []}
              combs={combs}
              tool={tool}
              restFrame={restFrame}
              onPeak={setPickedPeak}
              controls={controls}
              describedBy="plot-help"
            />
            <Legend hasSky={arrays.sky !== null && showSky} hasModel={display.model !== null} hasOffset={combLines.some((l) => l.offsetKms !== undefined)} />
            {curves && curves.classes.length > 0 ? <Chi2Strip data={curves} solutions={solutions} store={store} onDraw={drawPhotoZ} /> : <p className="text-sm text-ink-500">{scan ? 'Loading χ²(z)…' : 'Not scanned yet: no χ²(z).'}</p>}
            {photoZFit ? <PhotoZNotice store={store} z95={photoZFit.z95} /> : null}
          </section>
          <Panel className={OWN_PAINT}>
            <FeaturePanels display={display} store={store} />
          </Panel>
        </div>

        <div className="flex min-w-0 flex-col gap-3">
          <Panel title="Solutions" className={OWN_PAINT}>
            {scan?.unknownReason ? <p className="mb-2 text-sm text-warning-700">Class unknown. {scan.unknownReason}</p> : null}
            {scan?.photoZPrior ? (
              <p className={`mb-2 text-sm ${scan.photoZPrior.movedTop ? 'text-warning-700' : 'text-ink-700'}`} data-testid="photoz-prior">
                {scan.photoZPrior.message}. Solutions below are in the scan's own order.
              </p>
            ) : null}
            <SolutionsList solutions={solutions} store={store} target={detail.target} onSnap={snap} />
            <label className="mt-2 flex items-center gap-2 text-sm text-ink-700">
              <input type="checkbox" checked={showModel} onChange={(e) => setShowModel(e.target.checked)} />
              Draw the template of solution {modelRank ?? '—'} over the data
            </label>
            {showModel && model.isError ? <p className="text-xs text-warning-700">{model.error.message}</p> : null}
          </Panel>
          <Panel title="Reading" className={OWN_PAINT}>
            {canRead ? (
              <ReadingForm
                spectrumId={spectrumId}
                store={store}
                solutions={solutions}
                scheme={campaign.gradeScheme}
                draft={draft}
                onDraft={setDraft}
                mine={mine}
                pending={pending}
                error={error}
                onSave={() => save(draft)}
                noteRef={noteRef}
              />
            ) : (
              <Notice tone="info">You are not assigned to read this spectrum, so there is no reading form here. The comb and plots work as usual.</Notice>
            )}
          </Panel>
          {scan ? (
            <Panel title="Peaks and line pairs" className={OWN_PAINT}>
              <PeaksPanel lineMatches={scan.lineMatches} lines={lines} zMin={store.min} zMax={store.max} picked={pickedPeak} onPick={setPickedPeak} onZ={(v) => store.set(v)} />
            </Panel>
          ) : null}
          {aside}
          <Panel title="Context" className={OWN_PAINT}>
            <ContextPanel detail={detail} arrays={arrays} />
          </Panel>
        </div>
      </div>
      <KeyHelp open={helpOpen} onClose={() => setHelpOpen(false)} />
    </div>
  );
}

/**
 * The next spectrum as the plot will show it when the reader moves on (same smoothing; its top
 * solution's template when templates are drawn), made on demand. Reads what the screen prefetched.
 */
function useUpcomingDisplay(nextId: number | null, smoothingChoice: Smoothing | null, showModel: boolean) {
  const data = useQuery({ ...getSpectrumDataQueryOptions(nextId ?? 0), enabled: nextId !== null });
  // The next spectrum's scan id comes from its detail, which the screen prefetched.
  const detail = useQuery({ ...getSpectrumDetailQueryOptions(nextId ?? 0), enabled: nextId !== null });
  const nextScanId = detail.data?.scan?.id ?? null;
  const model = useQuery({ ...getSolutionModelQueryOptions(nextId ?? 0, nextScanId ?? 0, 1), enabled: nextId !== null && nextScanId !== null && showModel, retry: false });
  const arrays = nextId !== null ? data.data : undefined;
  const nextModel = showModel && nextId !== null ? (model.data ?? null) : null;
  return useMemo(() => (arrays ? () => displayArraysOf(arrays, smoothingChoice ?? defaultSmoothing(spectrumSnr(arrays)), nextModel) : null), [arrays, smoothingChoice, nextModel]);
}

function Legend({ hasSky, hasModel, hasOffset }: { hasSky: boolean; hasModel: boolean; hasOffset: boolean }) {
  const item = 'inline-flex items-center gap-1.5';
  return (
    <ul aria-label="Plot legend" className={`flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-600 ${OWN_PAINT}`}>
      <li className={item}>
        <span aria-hidden="true" className="inline-block h-0.5 w-4 bg-ink-900" /> flux
      </li>
      <li className={item}>
        <span aria-hidden="true" className="inline-block h-2.5 w-4 bg-blueend-400/30" /> ±1σ
      </li>
      {hasSky ? (
        <li className={item}>
          <span aria-hidden="true" className="inline-block h-0.5 w-4 bg-ink-400" /> sky
        </li>
      ) : null}
      {hasModel ? (
        <li className={item}>
          <span aria-hidden="true" className="inline-block h-0.5 w-4" style={{ background: PLOT.model }} /> template of the solution
        </li>
      ) : null}
      <li className={item}>
        <span aria-hidden="true" className="inline-block h-2.5 w-4 bg-danger-600/15" /> masked
      </li>
      <li className={item}>
        <span aria-hidden="true" className="inline-block h-3 w-0 border-l border-ember-600" /> emission (solid)
      </li>
      <li className={item}>
        <span aria-hidden="true" className="inline-block h-3 w-0 border-l border-dashed border-blueend-600" /> absorption (dashed)
      </li>
      <li className={item}>
        <span aria-hidden="true" className="inline-block h-3 w-0 border-l border-dotted border-ink-700" /> band / break (dotted)
      </li>
      {hasOffset ? (
        <li className={item}>
          <span aria-hidden="true" className="inline-block h-2 w-0 border-l-2 border-ember-600" /> short tick: where the solution&apos;s template puts the line (e.g. Lyα +300 km/s)
        </li>
      ) : null}
      <li className={item}>
        <span aria-hidden="true" className="text-success-700">▲</span> detected peak (click to name it)
      </li>
      <li className={item}>hover a marker: every line there, also those whose label had no room</li>
    </ul>
  );
}
