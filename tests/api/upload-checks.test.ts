import { readdirSync, writeFileSync } from 'node:fs';
import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { jobItems, jobs, storedFiles } from '../../backend/src/db/schema';
import { receiveUpload } from '../../backend/src/services/receive-upload';
import { userIdOf } from '../helpers/assigned-spectra';
import { syntheticSpectrumFiles, zip } from '../helpers/spectrum-archives';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  // No runner: these tests look at what the upload itself records.
  t = await createTestApp({ JOB_RUNNER: '0' });
});
afterAll(() => t.cleanup());

const spectrumBytes = (i: number) => Object.values(syntheticSpectrumFiles(i + 1, { prefix: 'UPL' }))[i]!;
const itemNames = (jobId: number) => t.ctx.db.select({ name: jobItems.fileName }).from(jobItems).where(eq(jobItems.jobId, jobId)).all().map((r) => r.name).sort();
const counts = () => ({ jobs: t.ctx.db.select({ n: count() }).from(jobs).get()!.n, files: t.ctx.db.select({ n: count() }).from(storedFiles).get()!.n });

describe('upload checks', () => {
  it('refuses an empty file at upload, naming it, and stores nothing of that upload', async () => {
    const lead = await t.signIn('lead@demo.test');
    const before = counts();
    const res = await lead
      .post('/api/campaigns/1/uploads')
      .attach('files', Buffer.from(spectrumBytes(0)), 'UPL-0001.csv')
      .attach('files', Buffer.alloc(0), 'UPL-0002.csv');
    expect(res.status).toBe(400);
    expect(res.body.error).toEqual({
      code: 'file_empty',
      message: 'UPL-0002.csv is empty (0 bytes); it may not have finished copying. Send it again. Nothing from this upload was stored.',
    });
    expect(counts()).toEqual(before);
    // The temporary copies are gone too.
    expect(readdirSync(t.ctx.store.tmpDir)).toEqual([]);
  });

  it('records archive entries that climb out of the archive or are absolute by their base name', async () => {
    const lead = await t.signIn('lead@demo.test');
    const archive = zip({ '../../escape/UPL-0001.csv': spectrumBytes(0), '/srv/obs/UPL-0002.csv': spectrumBytes(1), 'night1/UPL-0003.csv': spectrumBytes(2) });
    const res = await lead.post('/api/campaigns/1/uploads').attach('files', archive, 'night.zip');
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    expect(itemNames(res.body.jobId)).toEqual(['night.zip/UPL-0001.csv', 'night.zip/UPL-0002.csv', 'night.zip/night1/UPL-0003.csv']);
  });

  it('records a file named with ../ or an absolute path (as the import command may pass it) by its base name', async () => {
    const lead = { id: userIdOf(t, 'lead@demo.test'), email: 'lead@demo.test', name: 'Lena', isAdmin: false };
    const files = ['../../etc/UPL-0004.csv', '/home/obs/UPL-0005.csv', 'C:\\obs\\UPL-0006.csv'].map((originalName, i) => {
      const tempFile = t.ctx.store.tempPath();
      writeFileSync(tempFile, spectrumBytes(3 + i));
      return { originalName, tempFile };
    });
    const { jobId } = await receiveUpload(t.ctx, t.ctx.store, lead, 1, files);
    expect(itemNames(jobId)).toEqual(['UPL-0004.csv', 'UPL-0005.csv', 'UPL-0006.csv']);
  });
});
