import { useEffect, useRef, useState } from 'react';
import { SelectField, TextField } from '@/components/ui/field';
import type { SpectraQueryState } from '../hooks/use-spectra-query';
import { CLASS_LABELS } from './spectrum-class';
import type { SpectrumClass } from './spectrum-class';

interface Props {
  query: SpectraQueryState;
  onChange: (patch: Partial<SpectraQueryState>, options?: { replace?: boolean }) => void;
}

export function SpectraFilters({ query, onChange }: Props) {
  const [search, setSearch] = useState(query.q ?? '');
  const timer = useRef<ReturnType<typeof setTimeout>>(undefined);
  useEffect(() => () => clearTimeout(timer.current), []);

  // Typing writes the URL once per pause; replace keeps each keystroke out of the history.
  const onType = (value: string) => {
    setSearch(value);
    clearTimeout(timer.current);
    timer.current = setTimeout(() => onChange({ q: value.trim() || undefined }, { replace: true }), 300);
  };

  // Back/forward or a shared link changes the URL under the box: show what is searched.
  const [shownQ, setShownQ] = useState(query.q);
  if (shownQ !== query.q) {
    setShownQ(query.q);
    if ((query.q ?? '') !== search.trim()) setSearch(query.q ?? '');
  }

  return (
    <div role="search" className="grid grid-cols-1 gap-3 sm:grid-cols-[minmax(0,1fr)_12rem_10rem]">
      <TextField label="Search spectra" type="search" hint="File name, target id or OBJECT name." value={search} onChange={(e) => onType(e.target.value)} />
      <SelectField label="Class" value={query.class ?? ''} onChange={(e) => onChange({ class: (e.target.value || undefined) as SpectrumClass | undefined })}>
        <option value="">any class</option>
        {(Object.keys(CLASS_LABELS) as SpectrumClass[]).map((c) => (
          <option key={c} value={c}>
            {CLASS_LABELS[c]}
          </option>
        ))}
      </SelectField>
      <SelectField label="Linked" value={query.linked ?? ''} onChange={(e) => onChange({ linked: (e.target.value || undefined) as 'yes' | 'no' | undefined })}>
        <option value="">all spectra</option>
        <option value="yes">linked to a target</option>
        <option value="no">not linked</option>
      </SelectField>
    </div>
  );
}
