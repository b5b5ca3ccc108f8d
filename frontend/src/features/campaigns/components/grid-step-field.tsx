import { GRID_STEP_CHOICES } from '@contracts/campaigns';
import type { ComponentProps } from 'react';
import { SelectField } from '@/components/ui/field';
import { GRID_STEP_LABELS } from '@/lib/format';

type Props = Omit<ComponentProps<typeof SelectField>, 'label' | 'children'>;

/** The pixels a campaign's scans use: 1e-4 dex for every file, or each file's own sampling. */
export function GridStepField({ hint, ...select }: Props) {
  return (
    <SelectField label="Scan grid" hint={hint ?? "Own sampling: each file's median pixel, rounded to a step between 17 and 550 km/s."} {...select}>
      {GRID_STEP_CHOICES.map((g) => (
        <option key={g} value={g}>
          {GRID_STEP_LABELS[g]}
        </option>
      ))}
    </SelectField>
  );
}
