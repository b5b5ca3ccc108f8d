import { z } from 'zod';
import { gridStepSchema } from './campaigns';

/** File name endings Redward reads as spectra (case-insensitive); zip archives hold any of them. */
export const SPECTRUM_FILE_ENDINGS = ['.fits', '.fit', '.fts', '.fits.gz', '.fit.gz', '.fts.gz', '.csv', '.tsv', '.txt', '.dat', '.ascii'] as const;

export const jobStateSchema = z.enum(['queued', 'running', 'done', 'failed', 'cancelled']);
export type JobState = z.infer<typeof jobStateSchema>;

export const jobErrorSchema = z.object({ file: z.string(), code: z.string(), message: z.string() });
export type JobError = z.infer<typeof jobErrorSchema>;

export const jobProgressSchema = z.object({
  id: z.number().int(),
  /** ingest: an upload; scan: a re-scan; photoz: the photo-z fit of a large catalogue import. */
  kind: z.enum(['ingest', 'scan', 'photoz']),
  campaignId: z.number().int(),
  state: jobStateSchema,
  done: z.number().int(),
  total: z.number().int(),
  /** Files that could not be read or scanned, with the reason. */
  errors: z.array(jobErrorSchema),
  summary: z.object({
    stored: z.number().int(),
    duplicates: z.number().int(),
    rescanned: z.number().int(),
    failed: z.number().int(),
    linked: z.number().int(),
    unlinked: z.number().int(),
  }),
  failure: z.string().nullable(),
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
});
export type JobProgress = z.infer<typeof jobProgressSchema>;

/** What became of one file of a job: stored, a duplicate or failed (why); its target or none; its top solution once scanned. */
export const jobFileSchema = z.object({
  file: z.string(),
  state: z.enum(['pending', 'done', 'failed']),
  outcome: z.enum(['stored', 'duplicate', 'rescanned']).nullable(),
  error: z.object({ code: z.string(), message: z.string() }).nullable(),
  spectrumId: z.number().int().nullable(),
  target: z.object({ id: z.number().int(), catalogueId: z.string(), linkMethod: z.string().nullable() }).nullable(),
  objectName: z.string().nullable(),
  instrument: z.string().nullable(),
  scan: z.object({ zBest: z.number().nullable(), spectrumClass: z.string() }).nullable(),
  /** First and second readers assigned to the spectrum (0–2). */
  readersAssigned: z.number().int(),
});
export type JobFile = z.infer<typeof jobFileSchema>;

export const jobFilesSchema = z.object({
  jobId: z.number().int(),
  files: z.array(jobFileSchema),
  /** All files of the job; `files` holds the first MAX of them in upload order when truncated. */
  total: z.number().int(),
  truncated: z.boolean(),
});
export type JobFiles = z.infer<typeof jobFilesSchema>;

export const uploadReceiptSchema = z.object({
  jobId: z.number().int(),
  files: z.number().int(),
  entries: z.number().int(),
  bytes: z.number().int(),
});
export type UploadReceipt = z.infer<typeof uploadReceiptSchema>;

export const SPECTRA_SORT_KEYS = ['fileName', 'target', 'instrument', 'snr', 'z', 'class', 'createdAt'] as const;

export const spectraQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
  sort: z.enum(SPECTRA_SORT_KEYS).default('fileName'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  /** Matches file name, target id or object name. */
  q: z.string().trim().max(200).optional(),
  class: z.enum(['galaxy', 'quasar', 'star', 'lyman-break', 'unknown']).optional(),
  linked: z.enum(['yes', 'no']).optional(),
});
export type SpectraQuery = z.input<typeof spectraQuerySchema>;

export const spectrumRowSchema = z.object({
  id: z.number().int(),
  fileName: z.string(),
  target: z.object({ id: z.number().int(), catalogueId: z.string() }).nullable(),
  linkMethod: z.string().nullable(),
  objectName: z.string().nullable(),
  instrument: z.string().nullable(),
  pixels: z.number().int(),
  wavelengthMin: z.number(),
  wavelengthMax: z.number(),
  snrMedian: z.number().nullable(),
  scanState: z.enum(['scanned', 'not scanned']),
  /** Readers assigned, and readings saved (for a reader viewing the list: only their own, 0 or 1). */
  readingsAssigned: z.number().int(),
  readingsDone: z.number().int(),
  zBest: z.number().nullable(),
  zBestErr: z.number().nullable(),
  spectrumClass: z.string().nullable(),
  createdAt: z.string(),
});
export type SpectrumRow = z.infer<typeof spectrumRowSchema>;

export const spectraPageSchema = z.object({
  rows: z.array(spectrumRowSchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type SpectraPage = z.infer<typeof spectraPageSchema>;

/** Re-scan the spectra whose scans are out of date (default) or every spectrum. */
export const rescanRequestSchema = z.object({ all: z.boolean().default(false) }).strict();

export const scanStatusSchema = z.object({
  spectra: z.number().int(),
  upToDate: z.number().int(),
  stale: z.number().int(),
  engineVersion: z.string(),
  zMin: z.number(),
  zMax: z.number(),
  gridStep: gridStepSchema,
});
export type ScanStatus = z.infer<typeof scanStatusSchema>;
export const rescanResponseSchema = z.object({ jobId: z.number().int(), spectra: z.number().int() });

export const jobListSchema = z.object({ jobs: z.array(jobProgressSchema.omit({ errors: true })) });
export type JobSummaryRow = z.infer<typeof jobListSchema>['jobs'][number];
