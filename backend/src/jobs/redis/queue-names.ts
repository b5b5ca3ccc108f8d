/** The BullMQ queue scan items wait in (one per Redis database: use a database per installation). */
export const SCAN_QUEUE = 'redward-scan';

/** The BullMQ job id of an item: adding an item twice (a re-dispatch after a restart) is a no-op. */
export const bullJobIdOf = (itemId: number) => `item-${itemId}`;
export const itemIdOfBullJob = (jobId: string | undefined): number | null => {
  const m = /^item-(\d+)$/.exec(jobId ?? '');
  return m ? Number(m[1]) : null;
};
