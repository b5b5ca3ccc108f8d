import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { useReassignReading, useSpectrumAssignments } from '../api/spectrum-assignments';

const ORDER_LABEL = { first: 'First reading', second: 'Second reading' } as const;

/** Who reads this spectrum; a lead moves a reading that has not been made yet to someone else. */
export function SpectrumAssignments({ spectrumId }: { spectrumId: number }) {
  const query = useSpectrumAssignments(spectrumId);
  if (!query.data) return query.isError ? <ErrorNotice error={query.error} /> : null;
  const { assignments, candidates } = query.data;
  return (
    <div className="flex flex-col gap-2">
      {(['first', 'second'] as const).map((order) => {
        const a = assignments.find((x) => x.readingOrder === order) ?? null;
        const other = assignments.find((x) => x.readingOrder !== order)?.readerId;
        return <AssignmentRow key={order} spectrumId={spectrumId} order={order} current={a} choices={candidates.filter((c) => c.id !== other)} />;
      })}
    </div>
  );
}

interface RowProps {
  spectrumId: number;
  order: 'first' | 'second';
  current: { readerId: number; name: string; read: boolean } | null;
  choices: { id: number; name: string; role: string }[];
}

function AssignmentRow({ spectrumId, order, current, choices }: RowProps) {
  const reassign = useReassignReading(spectrumId);
  const [readerId, setReaderId] = useState<number | ''>('');
  const id = `reassign-${spectrumId}-${order}`;
  return (
    <div className="text-sm">
      <p>
        <span className="font-medium text-ink-800">{ORDER_LABEL[order]}:</span> {current ? current.name : <span className="text-ink-500">nobody yet</span>}
        {current?.read ? <span className="text-ink-500"> (read)</span> : null}
      </p>
      {current?.read ? null : (
        <form
          className="mt-1 flex flex-wrap items-end gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            if (readerId !== '') reassign.mutate({ readingOrder: order, readerId });
          }}
        >
          <label htmlFor={id} className="sr-only">
            Reader for the {order} reading
          </label>
          <select id={id} className="rounded-control border border-paper-400 bg-paper-50 px-2 py-1" value={readerId} onChange={(e) => setReaderId(e.target.value === '' ? '' : Number(e.target.value))}>
            <option value="">Choose a reader…</option>
            {choices
              .filter((c) => c.id !== current?.readerId)
              .map((c) => (
                <option key={c.id} value={c.id}>
                  {c.name} ({c.role})
                </option>
              ))}
          </select>
          <Button size="sm" variant="secondary" type="submit" disabled={readerId === ''} pending={reassign.isPending} pendingLabel="Moving…">
            {current ? 'Reassign' : 'Assign'}
          </Button>
        </form>
      )}
      {reassign.isError ? <ErrorNotice error={reassign.error} /> : null}
      {reassign.isSuccess ? (
        <Notice tone="success" role="status">
          The {order} reading is now assigned.
        </Notice>
      ) : null}
    </div>
  );
}
