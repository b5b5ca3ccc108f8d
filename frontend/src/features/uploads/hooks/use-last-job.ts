const key = (campaignId: number) => `redward:last-upload-job:${campaignId}`;

/**
 * The last upload job started in this tab, per campaign: a lead who follows the nav link back
 * to the upload page (losing `?job=`) is offered the job again. Session storage, so it ends
 * with the tab and is never shared with another person on the same machine.
 */
export function rememberLastJob(campaignId: number, jobId: number): void {
  try {
    sessionStorage.setItem(key(campaignId), String(jobId));
  } catch {
    // Storage can be disabled (private modes, quotas); the URL still carries the job.
  }
}

export function lastJobOf(campaignId: number): number | null {
  try {
    const n = Number(sessionStorage.getItem(key(campaignId)));
    return Number.isInteger(n) && n > 0 ? n : null;
  } catch {
    return null;
  }
}
