import type { Disagreement } from '@contracts/release';
import { Link } from 'react-router-dom';
import { formatDateTime, formatRedshift } from '@/lib/format';

/** Open disagreements, oldest first as the server sends them; each item is a link so it can be bookmarked. */
export function DisagreementList({ items, selectedId }: { items: Disagreement[]; selectedId: number | null }) {
  return (
    <nav aria-label="Open disagreements">
      <ul className="flex flex-col gap-1">
        {items.map((d) => {
          const [a, b] = d.readings;
          const current = d.id === selectedId;
          return (
            <li key={d.id}>
              <Link
                to={`?disagreement=${d.id}`}
                aria-current={current ? 'true' : undefined}
                className={`flex flex-col rounded-control border px-2.5 py-1.5 text-sm ${current ? 'border-ember-500 bg-ember-50' : 'border-paper-300 bg-paper-50 hover:bg-paper-200'}`}
              >
                <span className="num font-medium text-ink-900">{d.target?.catalogueId ?? d.fileName}</span>
                <span className="num text-ink-600">
                  z {a ? formatRedshift(a.z) : '—'} vs {b ? formatRedshift(b.z) : '—'}
                </span>
                <span className="text-xs text-ink-500">
                  {d.reasons.join(', ')} · opened {formatDateTime(d.openedAt)}
                </span>
                {d.delegatedTo ? <span className="text-xs text-blueend-700">with {d.delegatedTo.name}</span> : null}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
