import { z } from 'zod';

/** Redward's target fields that a catalogue column can fill. */
export const TARGET_FIELDS = ['id', 'ra', 'dec', 'magnitude', 'photoZ', 'photoZLow', 'photoZHigh', 'imageFamily', 'priority'] as const;
export type TargetField = (typeof TARGET_FIELDS)[number];

/** Units a catalogue's band columns may be in. Magnitudes are AB with magnitude errors. */
export const FLUX_UNITS = ['nJy', 'uJy', 'ABmag'] as const;
export type FluxUnitName = (typeof FLUX_UNITS)[number];

/**
 * One band of the catalogue: the filter (a shipped curve's file stem or a campaign's own curve),
 * its flux (or magnitude) column and its error column.
 */
export const bandMappingSchema = z
  .object({
    filter: z.string().trim().min(1, 'Choose the filter of this band.').max(80),
    flux: z.string().min(1, 'Choose the flux column of this band.'),
    err: z.string().min(1, 'Choose the error column of this band.'),
    unit: z.enum(FLUX_UNITS),
  })
  .strict();
export type BandMapping = z.infer<typeof bandMappingSchema>;

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
    /** Flux or magnitude columns per filter, for the photometric redshift. */
    bands: z.array(bandMappingSchema).max(60).optional(),
  })
  .strict()
  .refine((m) => (m.ra === undefined) === (m.dec === undefined), { message: 'Map both RA and Dec, or neither.', path: ['dec'] })
  .refine((m) => new Set((m.bands ?? []).map((b) => b.filter)).size === (m.bands ?? []).length, { message: 'Each filter may be mapped once.', path: ['bands'] });
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
  /** Targets whose photometric redshift was computed from their band fluxes by this import. */
  photoZFits: z.number().int(),
  /**
   * A large import (more rows with photometry than the server's threshold) fits its photo-z in
   * this job instead (answered 202); its progress is at /api/jobs/:id. Null when fitted here.
   */
  photoZJobId: z.number().int().nullable(),
  errors: z.array(catalogueRowErrorSchema),
});
export type CatalogueImportResult = z.infer<typeof catalogueImportResultSchema>;

/** A computed photometric redshift in brief: best z, equal-tail intervals, interloper odds, star or galaxy. */
export const photoZSummarySchema = z.object({
  z: z.number(),
  z68: z.tuple([z.number(), z.number()]),
  z95: z.tuple([z.number(), z.number()]),
  /** P(z < 2): the odds of a low-redshift interloper. */
  pLowZ: z.number(),
  class: z.enum(['galaxy', 'star']),
  starChi2: z.number(),
  galaxyChi2: z.number(),
  galaxyTemplate: z.string(),
  starTemplate: z.string().nullable(),
  /** Bands that carried a measurement. */
  filters: z.array(z.string()),
});
export type PhotoZSummary = z.infer<typeof photoZSummarySchema>;

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
  /** The photometric redshift computed from the catalogue fluxes (null: no fluxes). */
  photoZFit: photoZSummarySchema.nullable(),
});
export type Target = z.infer<typeof targetSchema>;
export const targetListSchema = z.object({ targets: z.array(targetSchema) });

export const targetsQuerySchema = z.object({ q: z.string().trim().max(200).optional() });

/** One band of a target's spectral energy distribution. */
export const sedBandSchema = z.object({
  filter: z.string(),
  /** λ_eff of the curve, Å. */
  wavelengthEff: z.number(),
  fluxNjy: z.number(),
  errNjy: z.number(),
  /** Below 2σ: drawn as an upper limit at max(flux, 0) + 2σ. */
  detected: z.boolean(),
  given: z.object({ value: z.number(), error: z.number(), unit: z.enum(FLUX_UNITS) }),
});

/** A best-fit template through the bands: its band fluxes and its spectrum in the observed frame. */
export const sedModelSchema = z.object({
  kind: z.enum(['galaxy', 'star']),
  template: z.string(),
  z: z.number(),
  chi2: z.number(),
  /** In the order of `bands`, nJy. */
  bandFluxNjy: z.array(z.number()),
  curve: z.object({ wavelength: z.array(z.number()), fnuNjy: z.array(z.number()) }),
});

export const targetPhotometrySchema = z.object({
  targetId: z.number().int(),
  catalogueId: z.string(),
  bands: z.array(sedBandSchema),
  fit: photoZSummarySchema.nullable(),
  /** P(z) density on the fit's redshift grid (unit integral over z). */
  posterior: z.object({ z: z.array(z.number()), p: z.array(z.number()) }).nullable(),
  models: z.array(sedModelSchema),
  /** What the fit assumed, in words (filters, templates, IGM, error floor, prior). */
  assumptions: z.array(z.string()),
  /** The target's spectra, to open from its SED. */
  spectra: z.array(z.object({ id: z.number().int(), fileName: z.string() })),
  /**
   * Each spectrum's own synthetic photometry in the catalogue's bands it covers (flux-calibration
   * and slit-loss check). `calibrated`: the spectrum states a flux unit, so fluxes are nJy and the
   * ratio is absolute; otherwise fluxes are scaled to the catalogue by the median ratio and only
   * the ratios between bands mean something.
   */
  spectrumPhotometry: z.array(
    z.object({
      spectrumId: z.number().int(),
      fileName: z.string(),
      calibrated: z.boolean(),
      medianRatio: z.number().nullable(),
      bands: z.array(z.object({ filter: z.string(), wavelengthEff: z.number(), fluxNjy: z.number(), errNjy: z.number(), ratio: z.number(), ratioErr: z.number() })),
    }),
  ),
});
export type TargetPhotometry = z.infer<typeof targetPhotometrySchema>;

/** Filters a campaign can map bands to: the shipped curves and its own. */
export const filterInfoSchema = z.object({
  name: z.string(),
  source: z.enum(['shipped', 'campaign']),
  wavelengthEff: z.number(),
});
export const filterListSchema = z.object({ filters: z.array(filterInfoSchema) });
export type FilterInfo = z.infer<typeof filterInfoSchema>;

/** A campaign's own filter curve name: letters, digits, '.', '_', '-' (it becomes a column suffix). */
export const filterNameSchema = z.string().trim().regex(/^[A-Za-z0-9_.-]{1,60}$/, 'A filter name may hold only letters, digits, ".", "_" and "-" (at most 60).');

/** Links a spectrum to a target by hand (null unlinks). */
export const linkSpectrumRequestSchema = z.object({ targetId: z.number().int().positive().nullable() }).strict();
export type LinkSpectrumRequest = z.infer<typeof linkSpectrumRequestSchema>;
export const linkSpectrumResponseSchema = z.object({ spectrumId: z.number().int(), targetId: z.number().int().nullable() });
