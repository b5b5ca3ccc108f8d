import { z } from 'zod';

/** The caveat shown beside a redshift that rests on Lyα alone, in the reading form and in exports (ASCII for FITS). */
export const LYA_CAVEAT =
  'z rests on Lya alone: Lya emission is typically offset redward of systemic by a few hundred km/s (Shapley et al. 2003, from memory)';

/** One comb line measured in the data (spectra/measureCombLines.ts LineMeasurement; fluxes scaled to `fluxUnit`). */
export const lineMeasurementSchema = z.object({
  name: z.string(),
  rest: z.number(),
  observed: z.number(),
  kind: z.enum(['emission', 'absorption', 'band', 'break']),
  blendedWith: z.array(z.string()),
  measure: z.enum(['flux', 'ew', 'break']),
  measured: z.boolean(),
  note: z.string().nullable(),
  flux: z.number().nullable(),
  fluxErr: z.number().nullable(),
  ewRest: z.number().nullable(),
  ewRestErr: z.number().nullable(),
  breakRatio: z.number().nullable(),
  breakRatioErr: z.number().nullable(),
  snr: z.number().nullable(),
  offsetKms: z.number().nullable(),
  offsetErrKms: z.number().nullable(),
  coverage: z.number(),
  detected: z.boolean(),
});
export type LineMeasurementView = z.infer<typeof lineMeasurementSchema>;

/** How the resolution element of a spectrum was obtained (spectra/resolutionElement.ts). */
export const resolutionSchema = z.object({ pixelKms: z.number(), fwhmKms: z.number(), from: z.string() });

/** GET /api/spectra/:id/lines?z=…&class=… — the comb's lines at a trial z, measured on demand. */
export const combLinesQuerySchema = z.object({
  z: z.coerce.number('z must be a number.').finite('z must be a finite number.').min(-0.01, 'z below −0.01 is not physical here.').max(12, 'z above 12 is outside every campaign.'),
  /** The solution's class: a quasar's lines are measured over broad-line windows. (Kept apart from readings.ts, which imports this file.) */
  class: z.enum(['galaxy', 'quasar', 'star', 'lyman-break', 'unknown']).optional(),
});

export const combLinesResponseSchema = z.object({
  z: z.number(),
  /** Unit of `flux` and `fluxErr` (the file's flux unit integrated over Å, or "arbitrary × Å"). */
  fluxUnit: z.string(),
  resolution: resolutionSchema,
  /** The smallest redshift error a reading can claim at this z: the σ of the resolution element. */
  zErrFloor: z.number(),
  lines: z.array(lineMeasurementSchema),
});
export type CombLines = z.infer<typeof combLinesResponseSchema>;

/** What a reading (and a confirmed redshift) stores of its lines: the measurements of the lines used. */
export const storedLineMeasurementsSchema = z.object({
  /** z at which the lines were measured. */
  z: z.number(),
  fluxUnit: z.string(),
  resolution: resolutionSchema,
  zErrFloor: z.number(),
  lines: z.array(lineMeasurementSchema),
});
export type StoredLineMeasurements = z.infer<typeof storedLineMeasurementsSchema>;
