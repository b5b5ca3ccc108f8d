import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { syntheticSpectrumFiles, zip } from '../helpers/spectrum-archives';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;

// A limit no scan can meet: every file overruns it, as a file that never finishes would.
beforeAll(async () => {
  t = await createTestApp({ SCAN_THREADS: '1', SCAN_TIME_LIMIT_S: '0.001' });
}, 60_000);
afterAll(() => t.cleanup());

describe('SCAN_TIME_LIMIT_S', () => {
  it('parses like the other settings and defaults to 60 s', async () => {
    const { loadConfig } = await import('../../backend/src/config');
    expect(loadConfig({}).jobs.scanTimeLimitMs).toBe(60_000);
    expect(loadConfig({ SCAN_TIME_LIMIT_S: '2.5' }).jobs.scanTimeLimitMs).toBe(2500);
    expect(() => loadConfig({ SCAN_TIME_LIMIT_S: '0' })).toThrow(/SCAN_TIME_LIMIT_S/);
  });

  it('fails each file that overruns it with the reason, and the job still finishes', { timeout: 60_000 }, async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await lead.post('/api/campaigns/1/uploads').attach('files', zip(syntheticSpectrumFiles(3, { prefix: 'SLOW' })), 'slow.zip');
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    let job;
    for (let i = 0; i < 250; i++) {
      job = (await lead.get(`/api/jobs/${res.body.jobId}`)).body;
      if (job.state !== 'queued' && job.state !== 'running') break;
      await new Promise((r) => setTimeout(r, 200));
    }
    expect(job.state).toBe('done');
    expect(job.summary).toMatchObject({ stored: 0, failed: 3 });
    expect(job.errors).toHaveLength(3);
    for (const e of job.errors) {
      expect(e.code).toBe('scan_timeout');
      expect(e.message).toMatch(/^The scan took longer than 0\.001 s and was stopped/);
    }
  });
});
