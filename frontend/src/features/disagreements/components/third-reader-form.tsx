import type { Disagreement } from '@contracts/release';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { useDelegateDisagreement } from '../api/delegate-disagreement';

export interface ThirdReader {
  userId: number;
  name: string;
}

/** A lead may hand the decision to someone who made neither reading; that person is e-mailed. */
export function ThirdReaderForm({ campaignId, disagreement: d, people }: { campaignId: number; disagreement: Disagreement; people: ThirdReader[] }) {
  const readerIds = new Set(d.readings.map((r) => r.reader.id));
  const choices = people.filter((p) => !readerIds.has(p.userId));
  const [chosen, setChosen] = useState(String(d.delegatedTo?.id ?? choices[0]?.userId ?? ''));
  const delegate = useDelegateDisagreement(campaignId);
  if (choices.length === 0) return <p className="text-sm text-ink-500">No other reader in the campaign made neither reading, so there is no one to send it to.</p>;

  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (chosen) delegate.mutate({ id: d.id, readerId: Number(chosen) });
      }}
    >
      <SelectField label="Third reader" value={chosen} onChange={(e) => setChosen(e.target.value)} fieldClassName="min-w-56">
        {choices.map((p) => (
          <option key={p.userId} value={p.userId}>
            {p.name}
          </option>
        ))}
      </SelectField>
      <Button type="submit" variant="secondary" pending={delegate.isPending} pendingLabel="Sending…">
        Send to a third reader
      </Button>
      <div className="basis-full empty:hidden">
        {d.delegatedTo ? (
          <Notice tone="info" role="status">
            With {d.delegatedTo.name} to settle; you may still settle it yourself.
          </Notice>
        ) : null}
        <ErrorNotice error={delegate.error} />
      </div>
    </form>
  );
}
