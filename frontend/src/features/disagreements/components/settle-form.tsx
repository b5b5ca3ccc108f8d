import type { Grade } from '@contracts/grades';
import type { SpectrumClass } from '@contracts/readings';
import { settleRequestSchema } from '@contracts/release';
import type { SettleRequest } from '@contracts/release';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { SelectField, TextAreaField, TextField } from '@/components/ui/field';
import { ErrorNotice } from '@/components/ui/notice';
import { CLASS_NAMES, CLASS_ORDER } from '@/lib/spectrum-class';

export interface Suggestion {
  z: number;
  cls: SpectrumClass;
  lines: string[];
  /** Changes on every click, so choosing the same solution twice still fills the field again. */
  nonce: number;
}

interface Props {
  scheme: Grade[];
  /** Starting class and grade for a new value: the lower-risk choice is the readers' common ground. */
  defaults: { grade: string; cls: SpectrumClass };
  suggestion: Suggestion | null;
  pending: boolean;
  error: unknown;
  onSettle: (body: SettleRequest) => void;
}

/** Accept one reading as it stands or enter a value; every decision carries the lead's reason. */
export function SettleForm({ scheme, defaults, suggestion, pending, error, onSettle }: Props) {
  const [reason, setReason] = useState('');
  const [entering, setEntering] = useState(false);
  const [value, setValue] = useState({ z: '', zErr: '', grade: defaults.grade, cls: defaults.cls, lines: '' });
  const [problems, setProblems] = useState<Record<string, string>>({});

  // An engine solution picked beside the form opens the value fields with its z, class and lines.
  const [seen, setSeen] = useState(suggestion?.nonce);
  if (suggestion && suggestion.nonce !== seen) {
    setSeen(suggestion.nonce);
    setEntering(true);
    setValue((v) => ({ ...v, z: suggestion.z.toFixed(5), cls: suggestion.cls, lines: suggestion.lines.join(', ') }));
  }

  const submit = (body: Record<string, unknown>) => {
    const parsed = settleRequestSchema.safeParse(body);
    if (!parsed.success) {
      const out: Record<string, string> = {};
      for (const issue of parsed.error.issues) out[String(issue.path[0] ?? 'form')] ??= issue.message;
      setProblems(out);
      return;
    }
    setProblems({});
    onSettle(body as SettleRequest);
  };

  const newValue = () => ({
    choice: 'new',
    reason,
    z: value.z.trim() === '' ? Number.NaN : Number(value.z),
    ...(value.zErr.trim() ? { zErr: Number(value.zErr) } : {}),
    grade: value.grade,
    class: value.cls,
    lines: value.lines
      .split(',')
      .map((l) => l.trim())
      .filter(Boolean),
  });

  return (
    <form
      aria-label="Settle the disagreement"
      noValidate
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        const body = newValue();
        // The schema's own message for NaN is about types; say what the lead should do instead.
        if (!Number.isFinite(body.z)) setProblems({ z: 'Enter the redshift as a number, e.g. 2.41875.' });
        else submit(body);
      }}
    >
      <TextAreaField
        label="Reason"
        required
        hint="Recorded with the confirmed value and shown in its history."
        error={problems.reason}
        value={reason}
        onChange={(e) => setReason(e.target.value)}
      />
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" pending={pending} onClick={() => submit({ choice: 'first', reason })}>
          Accept first reading
        </Button>
        <Button variant="secondary" pending={pending} onClick={() => submit({ choice: 'second', reason })}>
          Accept second reading
        </Button>
        <Button variant="quiet" aria-expanded={entering} aria-controls="settle-new-value" onClick={() => setEntering((o) => !o)}>
          Enter a value
        </Button>
      </div>
      {entering ? (
        <fieldset id="settle-new-value" className="flex flex-col gap-3 rounded-control border border-paper-300 p-3">
          <legend className="px-1 text-sm font-medium text-ink-800">New value</legend>
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
            <TextField label="z" inputMode="decimal" className="num" error={problems.z} value={value.z} onChange={(e) => setValue((v) => ({ ...v, z: e.target.value }))} />
            <TextField label="z error (optional)" inputMode="decimal" className="num" error={problems.zErr} value={value.zErr} onChange={(e) => setValue((v) => ({ ...v, zErr: e.target.value }))} />
            <SelectField label="Grade" className="num" value={value.grade} onChange={(e) => setValue((v) => ({ ...v, grade: e.target.value }))}>
              {scheme.map((g) => (
                <option key={g.code} value={g.code}>
                  {g.code} {g.label}
                </option>
              ))}
            </SelectField>
            <SelectField label="Class" value={value.cls} onChange={(e) => setValue((v) => ({ ...v, cls: e.target.value as SpectrumClass }))}>
              {CLASS_ORDER.map((c) => (
                <option key={c} value={c}>
                  {CLASS_NAMES[c]}
                </option>
              ))}
            </SelectField>
          </div>
          <TextField label="Lines" hint="Names as on the comb, separated by commas." value={value.lines} onChange={(e) => setValue((v) => ({ ...v, lines: e.target.value }))} />
          <div>
            <Button type="submit" pending={pending} pendingLabel="Settling…">
              Settle with this value
            </Button>
          </div>
        </fieldset>
      ) : null}
      <ErrorNotice error={error} />
    </form>
  );
}
