import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { createScanPool } from '../../../backend/src/jobs/scan-pool';
import { REAL_SPECTRA_DIR } from '../../../backend/src/fuzz/load-corpus';

const quasar = path.join(REAL_SPECTRA_DIR, 'highz/J0836+0054_ESI.txt');

describe('the scan pool’s time limit', () => {
  // 30 ms: a fresh thread builds its templates before the first scan, which takes far longer.
  const pool = createScanPool(1, { timeLimitMs: 30 });
  afterAll(() => pool.destroy());

  it('stops a scan that runs past the limit and answers with a failed file, then serves the next task on a fresh thread', { timeout: 30_000 }, async () => {
    const slow = await pool.run({ filePath: quasar, fileName: 'J0836+0054_ESI.txt', zMin: 0, zMax: 9, gridStep: 'default' });
    expect(slow).toEqual({
      ok: false,
      code: 'scan_timeout',
      message: 'The scan took longer than 0.03 s and was stopped (SCAN_TIME_LIMIT_S); the file is kept in storage, and the rest of the upload went on without it.',
    });
    // The one thread was terminated mid-scan; had it not been, this would wait for that scan.
    // The limit counts from the moment a thread begins the task, so starting a new one is free.
    const next = await pool.run({ filePath: path.join(REAL_SPECTRA_DIR, 'no-such-file.txt'), fileName: 'no-such-file.txt', zMin: 0, zMax: 9, gridStep: 'default' });
    expect(next).toMatchObject({ ok: false, code: 'unreadable' });
    expect((next as { message: string }).message).toMatch(/no-such-file\.txt/);
  });

  it('answers a model rebuilt past the limit with a sentence', { timeout: 30_000 }, async () => {
    const model = await pool.model({ filePath: quasar, solution: { z: 5.77, template: 'quasar' }, gridStep: 'default' });
    expect(model).toEqual({ ok: false, message: 'Rebuilding the model took longer than 0.03 s and was stopped.' });
  });
});

describe('with the default limit', () => {
  const pool = createScanPool(1);
  afterAll(() => pool.destroy());

  it('scans a real spectrum to the end', { timeout: 60_000 }, async () => {
    const r = await pool.run({ filePath: quasar, fileName: 'J0836+0054_ESI.txt', zMin: 0, zMax: 9, gridStep: 'default' });
    expect(r.ok).toBe(true);
    if (r.ok && r.scanned.ok) expect(r.scanned.scan.solutions[0]!.z).toBeGreaterThan(5);
    else throw new Error(JSON.stringify(r));
  });
});
