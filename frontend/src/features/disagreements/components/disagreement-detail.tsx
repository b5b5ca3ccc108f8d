import type { Grade } from '@contracts/grades';
import { SPECTRUM_CLASSES } from '@contracts/readings';
import type { SpectrumClass } from '@contracts/readings';
import type { Disagreement, SettleRequest } from '@contracts/release';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { Panel } from '@/components/ui/panel';
import { PLOT } from '@/components/spectrum/plot-palette';
import { gradeRank } from '@/lib/grade-label';
import { useLineList } from '@/lib/line-list';
import { useSpectrumData } from '@/lib/spectrum-data';
import { EngineSolutions } from './engine-solutions';
import { ReadingCard } from './reading-card';
import { SettleForm } from './settle-form';
import { ThirdReaderForm } from './third-reader-form';
import type { ThirdReader } from './third-reader-form';
import type { Suggestion } from './settle-form';
import { TwoReadingsPlot } from './two-readings-plot';

// The engine names classes like ours; anything it adds later settles as unknown rather than failing.
const asClass = (c: string): SpectrumClass => ((SPECTRUM_CLASSES as readonly string[]).includes(c) ? (c as SpectrumClass) : 'unknown');

const REASON_TEXT = { z: 'redshifts differ beyond the tolerance', grade: 'grades more than one step apart', class: 'classes differ' } as const;

interface Props {
  campaignId: number;
  /** Given to leads only: who may be handed the decision. */
  thirdReaders: ThirdReader[] | null;
  disagreement: Disagreement;
  scheme: Grade[];
  pending: boolean;
  error: unknown;
  onSettle: (body: SettleRequest) => void;
}

/** One open disagreement: both combs on the spectrum, both readings side by side, the engine, the decision. */
export function DisagreementDetail({ campaignId, thirdReaders, disagreement: d, scheme, pending, error, onSettle }: Props) {
  const data = useSpectrumData(d.spectrumId);
  const lines = useLineList();
  const [suggestion, setSuggestion] = useState<Suggestion | null>(null);
  const first = d.readings.find((r) => r.readingOrder === 'first');
  const second = d.readings.find((r) => r.readingOrder === 'second');
  if (!first || !second) return <ErrorNotice error={new Error('This disagreement does not carry both readings.')} />;
  const differs = new Set<string>(d.reasons);
  // The less confident of the two: later in the scheme.
  const lower = gradeRank(scheme, first.grade) >= gradeRank(scheme, second.grade) ? first.grade : second.grade;

  return (
    <div className="flex min-w-0 flex-col gap-4">
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-lg font-semibold text-ink-900">
          <span className="num">{d.target?.catalogueId ?? d.fileName}</span>
          {d.target?.imageFamily ? <span className="text-sm font-normal text-ink-500"> · image family {d.target.imageFamily}</span> : null}
        </h2>
        <Link to={`/spectra/${d.spectrumId}`} className="text-sm text-blueend-600 hover:underline">
          Open on the inspection screen
        </Link>
      </header>
      <p className="text-sm text-ink-700">Why it is open: {d.reasons.map((r) => REASON_TEXT[r]).join('; ')}.</p>

      <Panel title="Spectrum with both combs" level={3}>
        {data.error || lines.error ? (
          <ErrorNotice error={data.error ?? lines.error} title="The spectrum cannot be shown" />
        ) : !data.data || !lines.data ? (
          <Loading label="Loading the spectrum…" />
        ) : (
          <TwoReadingsPlot key={d.id} arrays={data.data} lines={lines.data} first={first} second={second} />
        )}
      </Panel>

      <div className="grid grid-cols-1 gap-3 md:grid-cols-2">
        <ReadingCard reading={first} scheme={scheme} differs={differs} colour={PLOT.readingFirst} />
        <ReadingCard reading={second} scheme={scheme} differs={differs} colour={PLOT.readingSecond} />
      </div>

      <Panel title="Engine solutions" level={3}>
        <EngineSolutions spectrumId={d.spectrumId} onUse={(s) => setSuggestion({ z: s.z, cls: asClass(s.class), lines: s.lines.map((l) => l.name), nonce: Date.now() })} />
      </Panel>

      <Panel title="Settle" level={3}>
        <SettleForm
          key={d.id}
          scheme={scheme}
          defaults={{ grade: lower, cls: first.class === second.class ? first.class : 'unknown' }}
          suggestion={suggestion}
          pending={pending}
          error={error}
          onSettle={onSettle}
        />
      </Panel>

      {thirdReaders ? (
        <Panel title="Or ask a third reader" level={3}>
          <ThirdReaderForm key={d.id} campaignId={campaignId} disagreement={d} people={thirdReaders} />
        </Panel>
      ) : null}
    </div>
  );
}
