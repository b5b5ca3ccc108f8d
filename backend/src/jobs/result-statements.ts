import { and, eq, sql } from 'drizzle-orm';
import { preparedQuery } from '../db/prepared';
import { assignments, jobItems, jobs, scanResults, spectra } from '../db/schema';

/**
 * The statements that record one scan result (`recordItemResult`), prepared once per database
 * handle. Built by Drizzle and compiled by SQLite on every call they cost ≈ 1.3–1.5 ms a result on
 * the web thread, six to eight of them per spectrum, during a whole ingest (issue 13's load
 * benchmark; `npm run bench:result-write` prints the figure). Placeholders in column places go
 * through the column's own mapping (JSON, booleans), as the builder's values would.
 */

export const itemState = preparedQuery((db) =>
  db
    .select({ state: jobItems.state })
    .from(jobItems)
    .where(eq(jobItems.id, sql.placeholder('itemId')))
    .prepare(),
);

/** A new spectrum, or nothing when the campaign already holds the same content. */
export const insertSpectrum = preparedQuery((db) =>
  db
    .insert(spectra)
    .values({
      campaignId: sql.placeholder('campaignId'),
      sha256: sql.placeholder('sha256'),
      fileName: sql.placeholder('fileName'),
      targetId: sql.placeholder('targetId'),
      linkMethod: sql.placeholder('linkMethod'),
      objectName: sql.placeholder('objectName'),
      ra: sql.placeholder('ra'),
      dec: sql.placeholder('dec'),
      instrument: sql.placeholder('instrument'),
      exposureS: sql.placeholder('exposureS'),
      dateObs: sql.placeholder('dateObs'),
      fluxUnit: sql.placeholder('fluxUnit'),
      medium: sql.placeholder('medium'),
      pixels: sql.placeholder('pixels'),
      wavelengthMin: sql.placeholder('wavelengthMin'),
      wavelengthMax: sql.placeholder('wavelengthMax'),
      snrMedian: sql.placeholder('snrMedian'),
      errorsEstimated: sql.placeholder('errorsEstimated'),
      warnings: sql.placeholder('warnings'),
      uploadJobId: sql.placeholder('uploadJobId'),
    })
    .onConflictDoNothing()
    .returning({ id: spectra.id })
    .prepare(),
);

export const spectrumByContent = preparedQuery((db) =>
  db
    .select({ id: spectra.id })
    .from(spectra)
    .where(and(eq(spectra.campaignId, sql.placeholder('campaignId')), eq(spectra.sha256, sql.placeholder('sha256'))))
    .prepare(),
);

export const insertAssignment = preparedQuery((db) =>
  db
    .insert(assignments)
    .values({
      spectrumId: sql.placeholder('spectrumId'),
      readerId: sql.placeholder('readerId'),
      readingOrder: sql.placeholder('readingOrder'),
      assignedBy: sql.placeholder('assignedBy'),
    })
    .prepare(),
);

/** The spectrum's current scan stops being current (a re-scan keeps it for the record). */
export const retireCurrentScan = preparedQuery((db) =>
  db
    .update(scanResults)
    .set({ isCurrent: false })
    .where(and(eq(scanResults.spectrumId, sql.placeholder('spectrumId')), eq(scanResults.isCurrent, true)))
    .prepare(),
);

export const insertScanResult = preparedQuery((db) =>
  db
    .insert(scanResults)
    .values({
      spectrumId: sql.placeholder('spectrumId'),
      jobId: sql.placeholder('jobId'),
      engineVersion: sql.placeholder('engineVersion'),
      settings: sql.placeholder('settings'),
      spectrumClass: sql.placeholder('spectrumClass'),
      zBest: sql.placeholder('zBest'),
      zBestErr: sql.placeholder('zBestErr'),
      solutions: sql.placeholder('solutions'),
      lineMatches: sql.placeholder('lineMatches'),
      meta: sql.placeholder('meta'),
      curves: sql.placeholder('curves'),
      isCurrent: true,
    })
    .prepare(),
);

/** Finishes the item only while it is still pending: the guard that makes recording idempotent. */
export const finishPendingItem = preparedQuery((db) =>
  db
    .update(jobItems)
    // An update's set takes no bare placeholder (Drizzle's types); these columns need no mapping.
    .set({
      state: sql`${sql.placeholder('state')}`,
      outcome: sql`${sql.placeholder('outcome')}`,
      spectrumId: sql`${sql.placeholder('spectrumId')}`,
      errorCode: sql`${sql.placeholder('errorCode')}`,
      errorMessage: sql`${sql.placeholder('errorMessage')}`,
    })
    .where(and(eq(jobItems.id, sql.placeholder('itemId')), eq(jobItems.state, 'pending')))
    .prepare(),
);

export const countItemDone = preparedQuery((db) =>
  db
    .update(jobs)
    .set({ done: sql`${jobs.done} + 1` })
    .where(eq(jobs.id, sql.placeholder('jobId')))
    .prepare(),
);
