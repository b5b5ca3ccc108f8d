import { TARGET_FIELDS } from '@contracts/targets';
import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { SelectField } from '@/components/ui/field';
import { FIELD_HINTS, FIELD_LABELS } from './mapping-schema';
import type { MappingFormValues } from './mapping-schema';

/** One select per Redward field, offering the catalogue's own column names. */
export function MappingFields({
  columns,
  register,
  errors,
}: {
  columns: string[];
  register: UseFormRegister<MappingFormValues>;
  errors: FieldErrors<MappingFormValues>;
}) {
  return (
    <div className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-3">
      {TARGET_FIELDS.map((field) => (
        <SelectField key={field} label={FIELD_LABELS[field]} hint={FIELD_HINTS[field]} error={errors[field]?.message} {...register(field)}>
          <option value="">{field === 'id' ? 'Choose a column…' : '— not in this catalogue —'}</option>
          {columns.map((c) => (
            <option key={c} value={c}>
              {c}
            </option>
          ))}
        </SelectField>
      ))}
    </div>
  );
}
