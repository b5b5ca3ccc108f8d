import type { SpectrumRow } from '@contracts/ingest';
import { useId, useState } from 'react';
import { Button } from '@/components/ui/button';
import { controlClass } from '@/components/ui/field';
import { errorMessage } from '@/components/ui/notice';

export interface LinkOption {
  id: number;
  catalogueId: string;
}

interface Props {
  spectrum: SpectrumRow;
  options: LinkOption[];
  onLink: (spectrumId: number, targetId: number) => Promise<unknown>;
}

/** A lead's manual link for a spectrum that no rule could match to a target. */
export function LinkTargetCell({ spectrum, options, onLink }: Props) {
  const id = useId();
  const [open, setOpen] = useState(false);
  const [targetId, setTargetId] = useState('');
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<unknown>(null);

  if (options.length === 0) return <span className="text-sm text-ink-500">no targets yet</span>;
  if (!open) {
    return (
      <Button variant="secondary" size="sm" aria-label={`Link ${spectrum.fileName} to target`} onClick={() => setOpen(true)}>
        Link to target
      </Button>
    );
  }

  const submit = () => {
    if (!targetId) return;
    setPending(true);
    setError(null);
    onLink(spectrum.id, Number(targetId))
      .catch((e: unknown) => setError(e))
      .finally(() => setPending(false));
  };

  return (
    <div className="flex flex-col gap-1">
      <div className="flex items-center gap-1">
        <label htmlFor={id} className="sr-only">
          Target for {spectrum.fileName}
        </label>
        {/* Opening the select moves focus into it, so a keyboard user continues where they pressed. */}
        <select id={id} autoFocus value={targetId} onChange={(e) => setTargetId(e.target.value)} className={`${controlClass} num w-40 py-0.5 text-sm`}>
          <option value="">Choose a target…</option>
          {options.map((t) => (
            <option key={t.id} value={t.id}>
              {t.catalogueId}
            </option>
          ))}
        </select>
        <Button size="sm" disabled={!targetId} pending={pending} pendingLabel="Linking…" onClick={submit}>
          Link
        </Button>
        <Button variant="quiet" size="sm" disabled={pending} onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
      {error ? (
        <p role="alert" className="text-sm text-danger-700">
          {errorMessage(error)}
        </p>
      ) : null}
    </div>
  );
}
