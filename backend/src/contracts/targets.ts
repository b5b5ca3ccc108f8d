import { z } from 'zod';

/** Redward's target fields that a catalogue column can fill. */
export const TARGET_FIELDS = ['id', 'ra', 'dec', 'magnitude', 'photoZ', 'photoZLow', 'photoZHigh', 'imageFamily', 'priority'] as const;
export type TargetField = (typeof TARGET_FIELDS)[number];

/** Which catalogue column fills which field; `id` is required, the rest optional. */
export const columnMappingSchema = z
  .object({
    id: z.string().min(1, 'Choose the column with the catalogue id.'),
    ra: z.string().min(1).optional(),
    dec: z.string().min(1).optional(),
    magnitude: z.string().min(1).optional(),
    photoZ: z.string().min(1).optional(),
    photoZLow: z.string().min(1).optional(),
    photoZHigh: z.string().min(1).optional(),
    imageFamily: z.string().min(1).optional(),
    priority: z.string().min(1).optional(),
  })
  .strict()
  .refine((m) => (m.ra === undefined) === (m.dec === undefined), { message: 'Map both RA and Dec, or neither.', path: ['dec'] });
export type ColumnMapping = z.infer<typeof columnMappingSchema>;

export const catalogueRowErrorSchema = z.object({
  /** Line number in the file, the header being line 1. */
  line: z.number().int(),
  column: z.string().nullable(),
  message: z.string(),
});
export type CatalogueRowError = z.infer<typeof catalogueRowErrorSchema>;

export const catalogueImportResultSchema = z.object({
  dryRun: z.boolean(),
  columns: z.array(z.string()),
  mapping: columnMappingSchema.nullable(),
  rows: z.number().int(),
  created: z.number().int(),
  updated: z.number().int(),
  /** Spectra linked to a target because of this import. */
  linked: z.number().int(),
  errors: z.array(catalogueRowErrorSchema),
});
export type CatalogueImportResult = z.infer<typeof catalogueImportResultSchema>;

export const targetSchema = z.object({
  id: z.number().int(),
  catalogueId: z.string(),
  ra: z.number().nullable(),
  dec: z.number().nullable(),
  magnitude: z.number().nullable(),
  photoZ: z.number().nullable(),
  photoZLow: z.number().nullable(),
  photoZHigh: z.number().nullable(),
  imageFamily: z.string().nullable(),
  priority: z.number().int().nullable(),
  extra: z.record(z.string(), z.string()),
  spectrumCount: z.number().int(),
});
export type Target = z.infer<typeof targetSchema>;
export const targetListSchema = z.object({ targets: z.array(targetSchema) });

export const targetsQuerySchema = z.object({ q: z.string().trim().max(200).optional() });

/** Links a spectrum to a target by hand (null unlinks). */
export const linkSpectrumRequestSchema = z.object({ targetId: z.number().int().positive().nullable() }).strict();
export type LinkSpectrumRequest = z.infer<typeof linkSpectrumRequestSchema>;
export const linkSpectrumResponseSchema = z.object({ spectrumId: z.number().int(), targetId: z.number().int().nullable() });
