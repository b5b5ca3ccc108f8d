import type { Grade } from '@contracts/grades';
import type { ConfirmedRedshift } from '@contracts/release';
import { Badge } from '@/components/ui/badge';
import { formatDateTime, formatRedshift, formatRedshiftError } from '@/lib/format';
import { gradeText } from '@/lib/grade-label';
import { CLASS_NAMES } from '@/lib/spectrum-class';

const METHOD = { agreement: 'readers agreed', settlement: 'settled', correction: 'corrected' } as const;

/** Newest first; superseded records stay visible because a released value is never changed in place. */
export function ConfirmedHistory({ history, scheme }: { history: ConfirmedRedshift[]; scheme: Grade[] }) {
  const ordered = [...history].sort((a, b) => b.id - a.id);
  return (
    <ol aria-label="Confirmed value history" className="flex flex-col gap-2">
      {ordered.map((r) => (
        <li key={r.id} className={`rounded-control border px-2.5 py-1.5 text-sm ${r.isCurrent ? 'border-success-700/30 bg-success-100/50' : 'border-paper-300 text-ink-600'}`}>
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <span className={`num ${r.isCurrent ? 'font-semibold text-ink-900' : 'line-through decoration-ink-400'}`}>
              z = {formatRedshift(r.z)}
              {r.zErr !== null ? ` ± ${formatRedshiftError(r.zErr)}` : ''}
            </span>
            {r.isCurrent ? <Badge tone="success">released</Badge> : <Badge>superseded</Badge>}
          </div>
          <p>
            grade <span className="num">{gradeText(scheme, r.grade)}</span> · {CLASS_NAMES[r.class]}
            {r.lines.length ? ` · ${r.lines.join(', ')}` : ''}
          </p>
          <p className="text-xs text-ink-500">
            #{r.id} {METHOD[r.method]}
            {r.decidedBy ? ` by ${r.decidedBy}` : ''}, <span className="num">{formatDateTime(r.createdAt)}</span>
            {r.supersedesId !== null ? ` · replaces #${r.supersedesId}` : ''}
          </p>
          {r.reason ? <p className="text-xs text-ink-700">Reason: {r.reason}</p> : null}
        </li>
      ))}
    </ol>
  );
}
