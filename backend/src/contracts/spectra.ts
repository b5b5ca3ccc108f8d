import { gridStepSchema } from './campaigns';
import { gradeSchemeSchema } from './grades';
import { readingSchema, spectrumClassSchema } from './readings';
import { targetSchema } from './targets';
import { z } from 'zod';

/*
 * What the inspection screen receives about one spectrum: GET /api/spectra/:id (built by
 * services/spectrum-detail.ts from the scan result) and GET /api/spectra/:id/scan-curves.
 */

/** A file's flux unit, normalised (spectra/types.ts FluxUnit): file value × scale is in `unit`. */
export const fluxUnitSchema = z.object({
  quantity: z.enum(['f-lambda', 'f-nu', 'counts', 'count-rate', 'arbitrary']),
  scale: z.number().positive(),
  unit: z.string(),
  raw: z.string().nullable(),
});
export type FluxUnitView = z.infer<typeof fluxUnitSchema>;

const solutionLineSchema = z.object({ name: z.string(), rest: z.number(), observed: z.number() });

export const solutionSchema = z.object({
  z: z.number(),
  zErr: z.number(),
  /** Systematic error from line offsets to the systemic redshift (Lyman-break galaxies, quasars; engine ≥ 0.6.0). */
  zSysErr: z.number().optional(),
  class: z.string(),
  template: z.string(),
  chi2: z.number(),
  deltaChi2: z.number().nullable(),
  detectionChi2: z.number(),
  lines: z.array(solutionLineSchema),
  priorWeight: z.number().optional(),
  /** χ² per degree of freedom of the solution's fit; zErr is scaled by its root when above 1 (absent in scans before engine 0.5.4). */
  reducedChi2: z.number().optional(),
  /** Share of the χ² gain in the strongest 0.006 dex window (absorption-line galaxies and stars). */
  featureShare: z.number().optional(),
  /** χ² added because one feature carried more than 90 % of the gain (included in chi2). */
  singleFeaturePenalty: z.number().optional(),
  /** χ² of the unfiltered continuum shape in coarse bins (included in chi2; engine ≥ 0.6.0). */
  shapeChi2: z.number().optional(),
  /** Quasars and Lyman-break sources: χ² of a Lyα forest too smooth for its redshift (included in chi2; engine ≥ 0.6.6). */
  forestChi2: z.number().optional(),
  /** Lyman-break solutions: the interloper alternatives with Δχ² against this solution (> 0 favours it). */
  interlopers: z
    .array(z.object({ kind: z.enum(['4000-break', 'cool-star', 'brown-dwarf', 'carbon-star']), label: z.string(), template: z.string(), z: z.number(), deltaChi2: z.number() }))
    .optional(),
});
export type Solution = z.infer<typeof solutionSchema>;

export const lineMatchesSchema = z.object({
  peaks: z.array(z.object({ wavelength: z.number(), snr: z.number() })),
  matches: z.array(z.object({ z: z.number(), lines: z.array(solutionLineSchema.extend({ snr: z.number() })) })),
  singleLine: z
    .object({
      wavelength: z.number(),
      snr: z.number(),
      alternatives: z.array(z.object({ line: z.string(), z: z.number(), separator: z.string(), expectedInRange: z.array(z.string()) })),
    })
    .optional(),
});
export type LineMatches = z.infer<typeof lineMatchesSchema>;

export const scanSchema = z.object({
  id: z.number().int(),
  engineVersion: z.string(),
  // Scans stored before campaigns had a grid setting carry no gridStep; they used 'default'.
  settings: z.looseObject({ zMin: z.number().optional(), zMax: z.number().optional(), gridStep: gridStepSchema.optional() }),
  class: z.string(),
  /** Why the class is 'unknown' (engine ≥ 0.6.0). */
  unknownReason: z.string().optional(),
  solutions: z.array(solutionSchema),
  /**
   * The photo-z prior applied when the detail was read (the stored order above is the scan's own):
   * the target's typed photo-z if it has one, else its computed P(z). `order` lists stored ranks
   * (0-based) best first under the prior; `message` says when the prior moved the top solution.
   */
  photoZPrior: z
    .object({ source: z.enum(['typed', 'computed']), order: z.array(z.number().int()), movedTop: z.boolean(), message: z.string() })
    .optional(),
  lineMatches: lineMatchesSchema,
  meta: z.object({
    pixels: z.number(),
    step: z.number(),
    wavelengthMin: z.number(),
    wavelengthMax: z.number(),
    medium: z.enum(['air', 'vacuum']),
    snrMedian: z.number(),
    masks: z.array(z.string()),
    zMin: z.number(),
    zMax: z.number(),
    templates: z.array(z.string()),
    chi2Null: z.number().optional(),
  }),
  createdAt: z.string().optional(),
});
export type Scan = z.infer<typeof scanSchema>;

export const spectrumDetailSchema = z.object({
  spectrum: z.object({
    id: z.number().int(),
    campaignId: z.number().int(),
    fileName: z.string(),
    objectName: z.string().nullable(),
    ra: z.number().nullable(),
    dec: z.number().nullable(),
    instrument: z.string().nullable(),
    exposureS: z.number().nullable(),
    dateObs: z.string().nullable(),
    /** Null for spectra stored before units were read (the data endpoint re-reads it from the file). */
    fluxUnit: fluxUnitSchema.nullable(),
    medium: z.string(),
    pixels: z.number().int(),
    wavelengthMin: z.number(),
    wavelengthMax: z.number(),
    snrMedian: z.number().nullable(),
    errorsEstimated: z.boolean(),
    warnings: z.array(z.string()),
  }),
  campaign: z.object({
    id: z.number().int(),
    name: z.string(),
    zMin: z.number(),
    zMax: z.number(),
    tolerance: z.number(),
    gridStep: gridStepSchema,
    gradeScheme: gradeSchemeSchema,
    myRole: z.enum(['lead', 'reader', 'observer']).nullable(),
  }),
  target: targetSchema.omit({ extra: true, spectrumCount: true }).nullable(),
  family: z.array(
    z.object({ spectrumId: z.number().int(), targetId: z.number().int(), catalogueId: z.string(), zBest: z.number().nullable(), readings: z.array(readingSchema) }),
  ),
  scan: scanSchema.nullable(),
  assignment: z.object({ readingOrder: z.enum(['first', 'second']) }).nullable(),
  readings: z.array(readingSchema),
});
export type SpectrumDetail = z.infer<typeof spectrumDetailSchema>;
export type DetailTarget = NonNullable<SpectrumDetail['target']>;

export const scanCurvesSchema = z.object({
  curves: z.array(z.object({ template: z.string(), class: z.string(), z: z.array(z.number()), chi2: z.array(z.number()) })),
});
export type ScanCurves = z.infer<typeof scanCurvesSchema>;


export { spectrumClassSchema };

/** GET /api/spectra/:id/solutions/:rank/model?scan=… — the scan whose solution is drawn (its id in the detail's `scan`). */
export const solutionModelQuerySchema = z.object({
  scan: z.coerce.number().int('The scan is named by its id, a whole number.').positive('The scan is named by its id, a positive number.').optional(),
});
