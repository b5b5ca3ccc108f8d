import type { Grade } from '@contracts/grades';
import type { SpectrumClass } from '@contracts/readings';
import { correctionRequestSchema } from '@contracts/release';
import type { ConfirmedRedshift } from '@contracts/release';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { SelectField, TextAreaField, TextField } from '@/components/ui/field';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { CLASS_NAMES, CLASS_ORDER } from '@/lib/spectrum-class';
import { useCorrectConfirmed } from '../api/correct-confirmed';

const blank = (c: ConfirmedRedshift) => ({ z: c.z.toFixed(5), zErr: c.zErr === null ? '' : String(c.zErr), grade: c.grade, cls: c.class, lines: c.lines.join(', '), reason: '' });

/** Opens on demand: a correction is rare and must be deliberate, so it is not left open on the screen. */
export function CorrectionForm({ spectrumId, current, scheme }: { spectrumId: number; current: ConfirmedRedshift; scheme: Grade[] }) {
  const [open, setOpen] = useState(false);
  const [v, setV] = useState(() => blank(current));
  const [problems, setProblems] = useState<Record<string, string>>({});
  const correct = useCorrectConfirmed(spectrumId);

  if (!open) {
    return (
      <div className="flex flex-col gap-2">
        {correct.isSuccess ? (
          <Notice tone="success" role="status">
            Correction released as record #{correct.data.confirmedId}; the earlier value is kept in the history.
          </Notice>
        ) : null}
        <div>
          <Button variant="secondary" size="sm" aria-expanded={false} onClick={() => (setV(blank(current)), correct.reset(), setOpen(true))}>
            Correct the released value
          </Button>
        </div>
      </div>
    );
  }

  const submit = () => {
    const body = {
      z: v.z.trim() === '' ? Number.NaN : Number(v.z),
      ...(v.zErr.trim() ? { zErr: Number(v.zErr) } : {}),
      grade: v.grade,
      class: v.cls,
      lines: v.lines.split(',').map((l) => l.trim()).filter(Boolean),
      reason: v.reason,
    };
    const parsed = correctionRequestSchema.safeParse(body);
    if (!parsed.success || !Number.isFinite(body.z)) {
      const out: Record<string, string> = {};
      if (!Number.isFinite(body.z)) out.z = 'Enter the redshift as a number.';
      for (const issue of parsed.error?.issues ?? []) out[String(issue.path[0] ?? 'form')] ??= issue.message;
      setProblems(out);
      return;
    }
    setProblems({});
    correct.mutate(body, { onSuccess: () => setOpen(false) });
  };

  return (
    <form
      aria-label="Correct the released value"
      noValidate
      className="flex flex-col gap-2 rounded-control border border-paper-300 p-3"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <p className="text-sm text-ink-600">The correction becomes the released value; the current one stays in the history as superseded.</p>
      <div className="grid grid-cols-2 gap-2">
        <TextField label="z" inputMode="decimal" className="num" error={problems.z} value={v.z} onChange={(e) => setV({ ...v, z: e.target.value })} />
        <TextField label="z error (optional)" inputMode="decimal" className="num" error={problems.zErr} value={v.zErr} onChange={(e) => setV({ ...v, zErr: e.target.value })} />
        <SelectField label="Grade" className="num" value={v.grade} onChange={(e) => setV({ ...v, grade: e.target.value })}>
          {scheme.map((g) => (
            <option key={g.code} value={g.code}>
              {g.code} {g.label}
            </option>
          ))}
        </SelectField>
        <SelectField label="Class" value={v.cls} onChange={(e) => setV({ ...v, cls: e.target.value as SpectrumClass })}>
          {CLASS_ORDER.map((c) => (
            <option key={c} value={c}>
              {CLASS_NAMES[c]}
            </option>
          ))}
        </SelectField>
      </div>
      <TextField label="Lines" hint="Separated by commas." value={v.lines} onChange={(e) => setV({ ...v, lines: e.target.value })} />
      <TextAreaField label="Reason" required error={problems.reason} value={v.reason} onChange={(e) => setV({ ...v, reason: e.target.value })} />
      <ErrorNotice error={correct.error} />
      <div className="flex gap-2">
        <Button type="submit" pending={correct.isPending} pendingLabel="Releasing…">
          Release the correction
        </Button>
        <Button variant="quiet" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
