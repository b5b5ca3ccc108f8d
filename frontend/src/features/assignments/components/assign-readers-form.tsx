import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { ErrorNotice } from '@/components/ui/notice';
import { useAssignReaders } from '../api/assign-readers';
import { AssignResultTable } from './assign-result';

export interface ReaderCandidate {
  userId: number;
  name: string;
  email: string;
  role: 'lead' | 'reader';
}

interface Props {
  campaignId: number;
  candidates: ReaderCandidate[];
  onAssigned?: () => void;
}

/**
 * Every spectrum without readers goes to two different people from the chosen ones; the
 * server balances the load and takes priority targets first, then mails each reader.
 */
export function AssignReadersForm({ campaignId, candidates, onAssigned }: Props) {
  const [chosen, setChosen] = useState<Set<number>>(() => new Set(candidates.filter((c) => c.role === 'reader').map((c) => c.userId)));
  const assign = useAssignReaders(campaignId, onAssigned);
  const toggle = (id: number) =>
    setChosen((s) => {
      const next = new Set(s);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
  const tooFew = chosen.size < 2;

  return (
    <form
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        if (!tooFew) assign.mutate([...chosen]);
      }}
    >
      <fieldset className="flex flex-col gap-1">
        <legend className="mb-1 text-sm font-medium text-ink-800">Readers to assign</legend>
        {candidates.map((c) => (
          <label key={c.userId} className="flex cursor-pointer items-baseline gap-2 rounded-control px-1 py-0.5 hover:bg-paper-200">
            <input type="checkbox" checked={chosen.has(c.userId)} onChange={() => toggle(c.userId)} className="accent-ember-600" />
            <span className="font-medium">{c.name}</span>
            <span className="text-sm text-ink-500">
              {c.email} · {c.role}
            </span>
          </label>
        ))}
        <p className="text-sm text-ink-500">
          {tooFew ? 'Choose at least two: every spectrum is read by two different people.' : `${chosen.size} chosen; each unassigned spectrum goes to two of them.`}
        </p>
      </fieldset>
      <ErrorNotice error={assign.error} />
      <div>
        <Button type="submit" disabled={tooFew} pending={assign.isPending} pendingLabel="Assigning…">
          Assign unassigned spectra
        </Button>
      </div>
      {assign.data ? <AssignResultTable result={assign.data} /> : null}
    </form>
  );
}
