import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { jobItems, jobs } from '../../backend/src/db/schema';
import { ResultBatch } from '../../backend/src/jobs/job-runner';
import type { JobSettings } from '../../backend/src/jobs/process-item';
import type { ScanTaskResult } from '../../backend/src/jobs/scan-worker';
import { syntheticSpectrumFiles, zip } from '../helpers/spectrum-archives';
import { createTestApp, type TestApp } from '../helpers/test-app';

// Without a runner, the upload's items stay pending and the test writes their results itself.
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ JOB_RUNNER: '0' });
});
afterAll(() => t.cleanup());

const failed = (code: string): ScanTaskResult => ({ ok: false, code, message: `test: ${code}` });

describe('ResultBatch (scan results written several to a transaction)', () => {
  it('writes nothing until flushed, keeps the others when one result fails, and stays idempotent', async () => {
    const lead = await t.signIn('lead@demo.test');
    const up = await lead.post('/api/campaigns/1/uploads').attach('files', zip(syntheticSpectrumFiles(4, { prefix: 'BATCH' })), 'batch.zip');
    expect(up.status).toBe(202);
    const job = t.ctx.db.select().from(jobs).where(eq(jobs.id, up.body.jobId)).get()!;
    const items = t.ctx.db.select().from(jobItems).where(eq(jobItems.jobId, job.id)).orderBy(jobItems.id).all();
    expect(items).toHaveLength(4);
    const rc = { ctx: t.ctx, job, settings: job.settings as unknown as JobSettings, targets: () => [] };
    const stateOf = () => t.ctx.db.select({ state: jobItems.state, code: jobItems.errorCode }).from(jobItems).where(eq(jobItems.jobId, job.id)).orderBy(jobItems.id).all();

    const batch = new ResultBatch(t.ctx.db, rc, 8, 60_000);
    batch.add(items[0]!, failed('first'));
    // A result the writer cannot use: it throws inside its own savepoint.
    batch.add(items[1]!, { ok: true } as unknown as ScanTaskResult);
    batch.add(items[2]!, failed('third'));
    expect(stateOf().map((r) => r.state)).toEqual(['pending', 'pending', 'pending', 'pending']);
    expect(() => batch.flush()).toThrow(TypeError);
    expect(stateOf()).toEqual([
      { state: 'failed', code: 'first' },
      { state: 'pending', code: null },
      { state: 'failed', code: 'third' },
      { state: 'pending', code: null },
    ]);
    expect(t.ctx.db.select({ done: jobs.done }).from(jobs).where(eq(jobs.id, job.id)).get()!.done).toBe(2);

    // Full at two: written without a flush. A repeat of a finished item changes nothing.
    const small = new ResultBatch(t.ctx.db, rc, 2, 60_000);
    small.add(items[0]!, failed('again'));
    small.add(items[3]!, failed('fourth'));
    expect(stateOf().map((r) => r.code)).toEqual(['first', null, 'third', 'fourth']);
    expect(t.ctx.db.select({ done: jobs.done }).from(jobs).where(eq(jobs.id, job.id)).get()!.done).toBe(3);
    small.flush();
  });
});
