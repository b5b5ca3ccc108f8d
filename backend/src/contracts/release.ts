import { z } from 'zod';
import { gradeCodeSchema } from './grades';
import { readingSchema, spectrumClassSchema } from './readings';

const decidedValueSchema = z.object({
  z: z.number().finite().min(-0.01).max(12),
  zErr: z.number().finite().positive().max(1).optional(),
  grade: gradeCodeSchema,
  class: spectrumClassSchema,
  lines: z.array(z.string().min(1).max(60)).max(40).default([]),
});

/** A lead's decision on a disagreement: take one reading as it is, or enter a value — always with a reason. */
export const settleRequestSchema = z.discriminatedUnion('choice', [
  z.object({ choice: z.enum(['first', 'second']), reason: z.string().trim().min(3, 'Say why, in a few words.').max(2000) }).strict(),
  decidedValueSchema.extend({ choice: z.literal('new'), reason: z.string().trim().min(3, 'Say why, in a few words.').max(2000) }).strict(),
]);
export type SettleRequest = z.input<typeof settleRequestSchema>;
export type SettleDecision = z.infer<typeof settleRequestSchema>;

/** A correction of a released value: a new record that supersedes the current one. */
export const correctionRequestSchema = decidedValueSchema.extend({ reason: z.string().trim().min(3, 'Say why, in a few words.').max(2000) }).strict();
export type CorrectionRequest = z.input<typeof correctionRequestSchema>;
export type CorrectionDecision = z.infer<typeof correctionRequestSchema>;

export const confirmedRedshiftSchema = z.object({
  id: z.number().int(),
  spectrumId: z.number().int(),
  z: z.number(),
  zErr: z.number().nullable(),
  grade: z.string(),
  class: spectrumClassSchema,
  lines: z.array(z.string()),
  method: z.enum(['agreement', 'settlement', 'correction']),
  reason: z.string().nullable(),
  decidedBy: z.string().nullable(),
  supersedesId: z.number().int().nullable(),
  isCurrent: z.boolean(),
  createdAt: z.string(),
});
export type ConfirmedRedshift = z.infer<typeof confirmedRedshiftSchema>;

export const disagreementSchema = z.object({
  id: z.number().int(),
  spectrumId: z.number().int(),
  fileName: z.string(),
  target: z.object({ id: z.number().int(), catalogueId: z.string(), imageFamily: z.string().nullable() }).nullable(),
  reasons: z.array(z.enum(['z', 'grade', 'class'])),
  readings: z.array(readingSchema),
  /** The third reader asked to settle it, if any. */
  delegatedTo: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  openedAt: z.string(),
});

export const delegateRequestSchema = z.object({ readerId: z.number().int().positive() }).strict();
export type Disagreement = z.infer<typeof disagreementSchema>;
/** GET /api/campaigns/:id/disagreements: the open ones the caller may settle. */
export const disagreementListSchema = z.array(disagreementSchema);
export const delegateResponseSchema = z.object({ disagreementId: z.number().int(), delegatedTo: z.object({ id: z.number().int(), name: z.string() }) });

/** A settlement or a correction answers with the confirmed record it created. */
export const confirmedIdResponseSchema = z.object({ confirmedId: z.number().int() });
/** Every confirmed record of one spectrum, current and superseded, oldest first. */
export const confirmedHistorySchema = z.object({ history: z.array(confirmedRedshiftSchema) });

export const assignReadersRequestSchema = z.object({ readerIds: z.array(z.number().int().positive()).min(2, 'Choose at least two readers.').max(200) }).strict();
export type AssignReadersRequest = z.infer<typeof assignReadersRequestSchema>;
export const assignReadersResponseSchema = z.object({
  assigned: z.number().int(),
  perReader: z.array(z.object({ readerId: z.number().int(), name: z.string(), first: z.number().int(), second: z.number().int() })),
});

export const reassignRequestSchema = z.object({ readingOrder: z.enum(['first', 'second']), readerId: z.number().int().positive() }).strict();

export const EXPORT_FORMATS = ['json', 'csv', 'ecsv', 'votable', 'fits'] as const;
export const confirmedQuerySchema = z.object({
  format: z.enum(EXPORT_FORMATS).default('json'),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(1000).default(100),
  /** A grade code of the campaign's scheme. */
  grade: z.string().trim().min(1).max(16).optional(),
  class: spectrumClassSchema.optional(),
  family: z.string().trim().max(80).optional(),
  /** How the value was confirmed: agreed by two readers, settled, or corrected after release. */
  confirmedBy: z.enum(['agreement', 'settlement', 'correction']).optional(),
});
export type ConfirmedQuery = z.input<typeof confirmedQuerySchema>;

export const SPECTRUM_STATES = ['unread', 'one reading', 'agreed', 'disagreement', 'settled'] as const;

export const confirmedRowSchema = z.object({
  id: z.number().int(),
  spectrumId: z.number().int(),
  fileName: z.string(),
  targetId: z.string().nullable(),
  ra: z.number().nullable(),
  dec: z.number().nullable(),
  z: z.number(),
  zErr: z.number().nullable(),
  gradeCode: z.string(),
  gradeLabel: z.string(),
  spectrumClass: spectrumClassSchema,
  lines: z.array(z.string()),
  /** The lines' measurements (exports/types.ts ExportLine); empty for records confirmed before lines were measured. */
  lineMeasurements: z.array(
    z.object({
      name: z.string(),
      measure: z.enum(['flux', 'ew', 'break']),
      value: z.number().nullable(),
      error: z.number().nullable(),
      snr: z.number().nullable(),
      offsetKms: z.number().nullable(),
      detected: z.boolean(),
      blendedWith: z.array(z.string()),
    }),
  ),
  lineFluxUnit: z.string().nullable(),
  zErrFloor: z.number().nullable(),
  photoZ: z.number().nullable(),
  photoZLow: z.number().nullable(),
  photoZHigh: z.number().nullable(),
  imageFamily: z.string().nullable(),
  readers: z.array(z.string()),
  confirmedBy: z.enum(['agreement', 'settlement', 'correction']),
  confirmedAt: z.string(),
  supersedes: z.number().int().nullable(),
  interloperZ: z.number().nullable(),
  interloperDeltaChi2: z.number().nullable(),
  starDeltaChi2: z.number().nullable(),
  /** Computed from the catalogue fluxes (see the z_phot export columns). */
  zPhot: z.number().nullable().optional(),
  zPhotLow: z.number().nullable().optional(),
  zPhotHigh: z.number().nullable().optional(),
  zPhotPLowZ: z.number().nullable().optional(),
});
export const confirmedPageSchema = z.object({
  rows: z.array(confirmedRowSchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
  /** How many spectra of the campaign are in each state. */
  states: z.record(z.enum(SPECTRUM_STATES), z.number().int()),
  assumptions: z.object({
    wavelengths: z.literal('vacuum'),
    cosmology: z.object({ name: z.string(), h0: z.number(), omegaM: z.number(), omegaLambda: z.number(), flat: z.literal(true) }),
    tolerance: z.number(),
  }),
});
export type ConfirmedPage = z.infer<typeof confirmedPageSchema>;

/** The consistency check of one image family (GET /api/campaigns/:id/families). */
export const familyCheckSchema = z.object({
  family: z.string(),
  members: z.array(z.object({ targetId: z.string().nullable(), spectrumId: z.number().int(), recordId: z.number().int(), z: z.number(), gradeCode: z.string(), gradeLabel: z.string() })),
  /** Images of the family without a confirmed redshift yet. */
  unconfirmed: z.array(z.object({ imageFamily: z.string(), targetId: z.string().nullable(), spectrumId: z.number().int().nullable(), openDisagreementId: z.number().int().nullable().optional() })),
  meanZ: z.number().nullable(),
  /** (max z − min z)/(1 + mean z) over the confirmed members. */
  spread: z.number().nullable(),
  discrepant: z.boolean(),
  incomplete: z.boolean(),
  flagged: z.boolean(),
});
export type FamilyCheck = z.infer<typeof familyCheckSchema>;
export const familiesResponseSchema = z.object({ families: z.array(familyCheckSchema), tolerance: z.number() });
export type FamiliesResponse = z.infer<typeof familiesResponseSchema>;

export const campaignStatisticsSchema = z.object({
  photoZ: z.object({
    threshold: z.number(),
    n: z.number().int(),
    outlierFraction: z.number().nullable(),
    sigmaNmad: z.number().nullable(),
    points: z.array(z.object({ spectrumId: z.number().int(), targetId: z.string().nullable(), zSpec: z.number(), zPhot: z.number(), outlier: z.boolean(), source: z.enum(['computed', 'catalogue']).optional() })),
  }),
  gradeDistribution: z.array(z.object({ code: z.string(), label: z.string(), count: z.number().int() })),
  readerPairs: z.array(z.object({ readers: z.tuple([z.string(), z.string()]), n: z.number().int(), agreeFraction: z.number(), kappaOnGrades: z.number().nullable() })),
  readingTime: z.array(z.object({ reader: z.string(), readings: z.number().int(), medianMs: z.number().nullable() })),
});
export type CampaignStatistics = z.infer<typeof campaignStatisticsSchema>;

export const spectrumAssignmentsSchema = z.object({
  assignments: z.array(z.object({ readingOrder: z.enum(['first', 'second']), readerId: z.number().int(), name: z.string(), read: z.boolean() })),
  /** Campaign members who may read (readers and leads). */
  candidates: z.array(z.object({ id: z.number().int(), name: z.string(), role: z.enum(['lead', 'reader']) })),
});
export type SpectrumAssignments = z.infer<typeof spectrumAssignmentsSchema>;
export const reassignResponseSchema = z.object({ spectrumId: z.number().int(), readingOrder: z.enum(['first', 'second']), readerId: z.number().int() });
