import { columnMappingSchema, TARGET_FIELDS } from '@contracts/targets';
import type { ColumnMapping, TargetField } from '@contracts/targets';
import { z } from 'zod';

export const FIELD_LABELS: Record<TargetField, string> = {
  id: 'Catalogue id column',
  ra: 'RA column',
  dec: 'Dec column',
  magnitude: 'Magnitude column',
  photoZ: 'Photometric z column',
  photoZLow: 'Photometric z lower (68 %) column',
  photoZHigh: 'Photometric z upper (68 %) column',
  imageFamily: 'Image family column',
  priority: 'Priority column',
};

export const FIELD_HINTS: Partial<Record<TargetField, string>> = {
  ra: 'Degrees or sexagesimal (hh:mm:ss.s).',
  dec: 'Degrees or sexagesimal (±dd:mm:ss).',
  imageFamily: 'Targets that are images of one lensed source share a value.',
};

/** Select values: a column name, or '' for a field the catalogue does not have. */
export type MappingFormValues = Record<TargetField, string>;

export const toFormValues = (mapping: ColumnMapping | null): MappingFormValues =>
  Object.fromEntries(TARGET_FIELDS.map((f) => [f, mapping?.[f] ?? ''])) as MappingFormValues;

/**
 * The form's strings become the API's mapping: empty optional fields are dropped, the id is
 * kept so an empty one fails with the contract's own sentence.
 */
export const mappingFormSchema = z
  .record(z.enum(TARGET_FIELDS), z.string())
  .transform((values) => Object.fromEntries(Object.entries(values).filter(([field, column]) => field === 'id' || column !== '')) as unknown as z.input<typeof columnMappingSchema>)
  .pipe(columnMappingSchema);
