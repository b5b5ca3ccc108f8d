import type { Grade } from '@contracts/grades';
import type { SpectrumClass } from '@contracts/readings';
import { SelectField } from '@/components/ui/field';
import { CLASS_NAMES, CLASS_ORDER } from '@/lib/spectrum-class';
import type { ConfirmedFilters } from '../hooks/use-confirmed-query';

interface Props {
  query: ConfirmedFilters;
  onChange: (patch: Partial<ConfirmedFilters>) => void;
  scheme: Grade[];
  families: string[];
}

export function ConfirmedFiltersBar({ query, onChange, scheme, families }: Props) {
  return (
    <div role="search" aria-label="Filter confirmed redshifts" className="grid grid-cols-1 gap-3 sm:grid-cols-3">
      <SelectField label="Grade" value={query.grade ?? ''} onChange={(e) => onChange({ grade: e.target.value === '' ? undefined : e.target.value })}>
        <option value="">any grade</option>
        {scheme.map((g) => (
          <option key={g.code} value={g.code}>
            {g.code} {g.label}
          </option>
        ))}
      </SelectField>
      <SelectField label="Class" value={query.class ?? ''} onChange={(e) => onChange({ class: (e.target.value || undefined) as SpectrumClass | undefined })}>
        <option value="">any class</option>
        {CLASS_ORDER.map((c) => (
          <option key={c} value={c}>
            {CLASS_NAMES[c]}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="How confirmed"
        value={query.confirmedBy ?? ''}
        onChange={(e) => onChange({ confirmedBy: (e.target.value || undefined) as ConfirmedFilters['confirmedBy'] })}
      >
        <option value="">agreed, settled or corrected</option>
        <option value="agreement">two readers agreed</option>
        <option value="settlement">settled</option>
        <option value="correction">corrected after release</option>
      </SelectField>
      <SelectField label="Image family" value={query.family ?? ''} onChange={(e) => onChange({ family: e.target.value || undefined })}>
        <option value="">any family or none</option>
        {families.map((f) => (
          <option key={f} value={f}>
            {f}
          </option>
        ))}
      </SelectField>
    </div>
  );
}
