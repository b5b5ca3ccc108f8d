import { z } from 'zod';
import { gradeCodeSchema } from './grades';
import { storedLineMeasurementsSchema } from './line-measurements';

export const SPECTRUM_CLASSES = ['galaxy', 'quasar', 'star', 'lyman-break', 'unknown'] as const;
export const spectrumClassSchema = z.enum(SPECTRUM_CLASSES);
export type SpectrumClass = z.infer<typeof spectrumClassSchema>;

/** A reading as a reader submits it. The campaign's range and grade scheme are checked on the server too. */
export const submitReadingRequestSchema = z
  .object({
    z: z.number().finite().min(-0.01, 'A redshift below −0.01 is not physical here.').max(12),
    /** The engine's error of the solution taken; the server widens it by the resolution floor (and uses the floor alone when absent). */
    zErr: z.number().finite().positive().max(1).optional(),
    /** A code of the campaign's grade scheme. */
    grade: gradeCodeSchema,
    class: spectrumClassSchema,
    /** Names from the line list (as on the comb) that support the redshift. */
    lines: z.array(z.string().min(1).max(60)).max(40).default([]),
    note: z.string().trim().max(4000).optional(),
    /** Milliseconds the reader spent on the spectrum before this save, measured by the client. */
    timeSpentMs: z.number().int().min(0).max(24 * 3600_000).optional(),
  })
  .strict();
export type SubmitReadingRequest = z.input<typeof submitReadingRequestSchema>;
/** A submitted reading as the server reads it (grade codes as text). */
export type SubmittedReading = z.infer<typeof submitReadingRequestSchema>;

export const readingSchema = z.object({
  id: z.number().int(),
  spectrumId: z.number().int(),
  reader: z.object({ id: z.number().int(), name: z.string() }),
  readingOrder: z.enum(['first', 'second']),
  z: z.number(),
  zErr: z.number().nullable(),
  grade: z.string(),
  class: spectrumClassSchema,
  lines: z.array(z.string()),
  /** The lines used, measured by the server at the reading's z; null for readings saved before lines were measured. */
  lineMeasurements: storedLineMeasurementsSchema.nullable(),
  note: z.string(),
  timeSpentMs: z.number().int(),
  revision: z.number().int(),
  locked: z.boolean(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Reading = z.infer<typeof readingSchema>;
export const readingResponseSchema = z.object({ reading: readingSchema, changed: z.boolean() });

export const queueItemSchema = z.object({
  id: z.number().int(),
  campaignId: z.number().int(),
  fileName: z.string(),
  readingOrder: z.enum(['first', 'second']),
  target: z.object({ id: z.number().int(), catalogueId: z.string(), imageFamily: z.string().nullable(), priority: z.number().int().nullable() }).nullable(),
  zBest: z.number().nullable(),
  spectrumClass: z.string().nullable(),
});
export type QueueItem = z.infer<typeof queueItemSchema>;
/** GET /api/me/queue: the caller's unread assignments in one campaign, in reading order. */
export const readingQueueSchema = z.array(queueItemSchema);
export const queueQuerySchema = z.object({ campaign: z.coerce.number().int().positive() });
