import { z } from 'zod';
import { gridStepSchema } from './campaigns';
import { fluxUnitSchema, lineMatchesSchema, scanSchema, solutionSchema } from './spectra';

/*
 * The scan-worker API (routes/workers.ts): admins manage worker tokens; a worker holding one takes
 * an item's file and posts what the scan found. Workers are `npm run jobs` processes on other
 * machines with JOB_QUEUE=redis://…; they never open the database.
 */

export const workerTokenSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  prefix: z.string(),
  createdAt: z.string(),
  lastUsedAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
});
export type WorkerToken = z.infer<typeof workerTokenSchema>;
export const workerTokenListSchema = z.object({ tokens: z.array(workerTokenSchema) });
export const createWorkerTokenSchema = z.object({ name: z.string().trim().min(1, 'Name the worker token (e.g. the machine it runs on).').max(100) });
export const createdWorkerTokenSchema = z.object({ token: z.string(), workerToken: workerTokenSchema });
export const revokedWorkerTokenSchema = z.object({ workerToken: workerTokenSchema });

/** What a worker needs to scan one item; also the payload of the item's queue entry. */
export const workerItemSchema = z.object({
  itemId: z.number().int().positive(),
  jobId: z.number().int().positive(),
  fileName: z.string(),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  zMin: z.number(),
  zMax: z.number(),
  gridStep: gridStepSchema,
});
export type WorkerItem = z.infer<typeof workerItemSchema>;

const spectrumMetaSchema = z.object({
  source: z.string(),
  objectName: z.string().optional(),
  ra: z.number().optional(),
  dec: z.number().optional(),
  instrument: z.string().optional(),
  exposureS: z.number().optional(),
  dateObs: z.string().optional(),
  medium: z.enum(['air', 'vacuum']),
  mediumFrom: z.enum(['header', 'default', 'override']),
  fluxUnit: z.string().optional(),
  errorsEstimated: z.boolean(),
  ignoredPixels: z.number().int().nonnegative().optional(),
  columns: z.record(z.string(), z.string()),
  warnings: z.array(z.string()),
});

const scanOutcomeSchema = z.discriminatedUnion('ok', [
  z.object({
    ok: z.literal(true),
    scan: z.object({
      engineVersion: z.string(),
      class: z.string(),
      unknownReason: z.string().optional(),
      solutions: z.array(solutionSchema),
      lineMatches: lineMatchesSchema,
      chi2Null: z.number(),
      // A spectrum without usable errors has no median S/N: NaN, which JSON carries as null.
      meta: scanSchema.shape.meta.omit({ chi2Null: true }).extend({ snrMedian: z.number().nullable() }),
    }),
  }),
  z.object({ ok: z.literal(false), code: z.literal('scan_failed'), message: z.string() }),
]);

/**
 * The JSON part of a posted result: the scan task's answer without its χ² curves, which follow
 * as packed bytes (jobs/scan-curves.ts) in the same body — see jobs/worker-result-body.ts.
 */
export const workerResultSchema = z.discriminatedUnion('ok', [
  z.object({
    ok: z.literal(true),
    spectrum: z.object({
      meta: spectrumMetaSchema,
      fluxUnit: fluxUnitSchema,
      pixels: z.number().int().positive(),
      wavelengthMin: z.number().positive(),
      wavelengthMax: z.number().positive(),
    }),
    scanned: scanOutcomeSchema,
  }),
  z.object({ ok: z.literal(false), code: z.string().min(1).max(64), message: z.string().min(1).max(2000) }),
]);
export type WorkerResult = z.infer<typeof workerResultSchema>;

/** The answer to a posted result, and to a repeated one: the item as it now stands. */
export const workerItemStateSchema = z.object({
  itemId: z.number().int(),
  state: z.enum(['pending', 'done', 'failed']),
  outcome: z.enum(['stored', 'duplicate', 'rescanned']).nullable(),
  spectrumId: z.number().int().nullable(),
  /** The current scan of the item's spectrum (null when none: a failed file or scan). */
  scanId: z.number().int().nullable(),
  /** False when this post changed nothing (the item had already been finished, by this worker or another). */
  applied: z.boolean(),
});
export type WorkerItemState = z.infer<typeof workerItemStateSchema>;
