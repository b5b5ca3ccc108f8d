import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { useAddFilter } from '../api/add-filter';

/** A lead adds the campaign's own filter curve: a name and a two-column text file (Å, transmission). */
export function FilterCurveForm({ campaignId }: { campaignId: number }) {
  const [name, setName] = useState('');
  const [file, setFile] = useState<File | null>(null);
  const add = useAddFilter(campaignId);
  return (
    <details className="text-sm">
      <summary className="cursor-pointer font-medium text-ink-800">Add the campaign’s own filter curve</summary>
      <form
        className="mt-2 flex flex-wrap items-end gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          if (file) add.mutate({ name: name.trim(), file });
        }}
      >
        <TextField label="Filter name" value={name} onChange={(e) => setName(e.target.value)} hint="Letters, digits, . _ -" fieldClassName="max-w-xs" />
        <TextField label="Curve file" type="file" accept=".txt,.dat,.par,.csv" onChange={(e) => setFile(e.target.files?.[0] ?? null)} hint="Two columns: wavelength (Å), transmission 0–1.5" />
        <Button type="submit" variant="secondary" pending={add.isPending} pendingLabel="Checking…" disabled={!file || name.trim() === ''}>
          Add the curve
        </Button>
      </form>
      <ErrorNotice error={add.error} title="The curve was refused" />
      {add.isSuccess ? (
        <Notice tone="success" role="status">
          Added {add.data.name} (λ_eff {Math.round(add.data.wavelengthEff)} Å); it can now be chosen as a band’s filter.
        </Notice>
      ) : null}
    </details>
  );
}
