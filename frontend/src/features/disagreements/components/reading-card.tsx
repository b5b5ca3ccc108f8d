import type { Grade } from '@contracts/grades';
import type { Reading } from '@contracts/readings';
import type { ReactNode } from 'react';
import { formatDateTime, formatRedshift, formatRedshiftError } from '@/lib/format';
import { gradeText } from '@/lib/grade-label';
import { CLASS_NAMES } from '@/lib/spectrum-class';

/** One reading as its reader left it; `differs` marks the fields that opened the disagreement. */
export function ReadingCard({ reading, scheme, differs, colour }: { reading: Reading; scheme: Grade[]; differs: Set<string>; colour: string }) {
  const title = reading.readingOrder === 'first' ? 'First reading' : 'Second reading';
  return (
    <section aria-label={title} className="flex min-w-0 flex-col gap-2 rounded-panel border border-paper-300 bg-paper-50 p-3" style={{ borderTopColor: colour, borderTopWidth: 3 }}>
      <h3 className="text-sm font-semibold text-ink-900">
        {title} <span className="font-normal text-ink-600">by {reading.reader.name}</span>
      </h3>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-sm">
        <Row term="Redshift" flagged={differs.has('z')}>
          <span className="num">
            z = {formatRedshift(reading.z)}
            {reading.zErr !== null ? ` ± ${formatRedshiftError(reading.zErr)}` : ''}
          </span>
        </Row>
        <Row term="Grade" flagged={differs.has('grade')}>
          <span className="num">{gradeText(scheme, reading.grade)}</span>
        </Row>
        <Row term="Class" flagged={differs.has('class')}>
          {CLASS_NAMES[reading.class]}
        </Row>
        <Row term="Lines">{reading.lines.length ? reading.lines.join(', ') : <span className="text-ink-400">none named</span>}</Row>
        <Row term="Note">{reading.note ? <span className="whitespace-pre-wrap">{reading.note}</span> : <span className="text-ink-400">no note</span>}</Row>
        <Row term="Saved">
          <span className="num">{formatDateTime(reading.updatedAt)}</span>
          {reading.timeSpentMs > 0 ? <span className="text-ink-500"> · {Math.round(reading.timeSpentMs / 1000)} s spent</span> : null}
        </Row>
      </dl>
    </section>
  );
}

function Row({ term, flagged, children }: { term: string; flagged?: boolean; children: ReactNode }) {
  return (
    <>
      <dt className="text-ink-500">{term}</dt>
      <dd className={`min-w-0 [overflow-wrap:anywhere] ${flagged ? 'font-semibold text-danger-700' : 'text-ink-900'}`}>
        {children}
        {flagged ? <span className="sr-only"> (differs)</span> : null}
      </dd>
    </>
  );
}
