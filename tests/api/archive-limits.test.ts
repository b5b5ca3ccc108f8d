import { readdirSync } from 'node:fs';
import path from 'node:path';
import { count } from 'drizzle-orm';
import { zipSync } from 'fflate';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { jobItems, storedFiles } from '../../backend/src/db/schema';
import { seededRandom } from '../../backend/src/fuzz/mutate-spectrum';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;

// No job runner: these tests are about what the upload accepts, not about scanning 15,000 files.
beforeAll(async () => {
  t = await createTestApp({ JOB_RUNNER: '0' });
}, 60_000);
afterAll(() => t.cleanup());

/** `n` distinct 18-byte files, as survey data arrive (one tiny file per object and exposure). */
function tinyFiles(n: number): Buffer {
  const files: Record<string, Uint8Array> = {};
  for (let i = 0; i < n; i++) files[`obs/${String(i).padStart(5, '0')}.txt`] = new TextEncoder().encode(`${String(i).padStart(13, '0')} 1.0\n`);
  return Buffer.from(zipSync(files, { level: 6 }));
}

const rows = (table: typeof storedFiles | typeof jobItems) => t.ctx.db.select({ n: count() }).from(table).get()!.n;
const tmpFiles = () => readdirSync(path.join(t.ctx.config.uploadsDir, 'tmp'));

describe('zip archives of many small files', () => {
  for (const n of [5000, 15_000]) {
    it(`accepts ${n.toLocaleString('en-US')} entries of 18 bytes (below the 20,000-entry limit)`, { timeout: 120_000 }, async () => {
      const lead = await t.signIn('lead@demo.test');
      const before = rows(jobItems);
      const res = await lead.post('/api/campaigns/1/uploads').attach('files', tinyFiles(n), `survey-${n}.zip`);
      expect(res.status, JSON.stringify(res.body)).toBe(202);
      expect(res.body).toMatchObject({ files: 1, entries: n, bytes: 18 * n });
      expect(rows(jobItems) - before).toBe(n);
      expect(tmpFiles()).toEqual([]);
    });
  }

  it('refuses 30,000 entries as too many, storing nothing', { timeout: 120_000 }, async () => {
    const lead = await t.signIn('lead@demo.test');
    const before = rows(storedFiles);
    const res = await lead.post('/api/campaigns/1/uploads').attach('files', tinyFiles(30_000), 'survey-30000.zip');
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('archive_too_many_entries');
    expect(res.body.error.message).toBe('survey-30000.zip holds more than 20000 files; split it into smaller archives. Nothing from this upload was stored.');
    expect(rows(storedFiles)).toBe(before);
    expect(tmpFiles()).toEqual([]);
  });
});

describe('zip bombs', () => {
  it('refuses a bomb hidden before a large honest file as soon as the running total passes the ratio', { timeout: 60_000 }, async () => {
    // 64 MB of zeros (≈ 64 kB deflated) first, then 2 MB of noise that deflate cannot shrink: the
    // whole archive's allowance (200 × ≈ 2.1 MB ≈ 420 MB) would let the bomb expand whole; the
    // running check stops it after ≈ 20 MB, when it passes 200 × what was read plus 16 MB.
    const rnd = seededRandom(9);
    const noise = Uint8Array.from({ length: 2 * 1024 * 1024 }, () => Math.floor(rnd() * 256));
    const archive = Buffer.from(zipSync({ 'a-first.fits': new Uint8Array(64 * 1024 * 1024), 'b-noise.fits': noise }, { level: 9 }));
    expect(archive.length).toBeGreaterThan(2 * 1024 * 1024);
    const before = rows(storedFiles);
    const lead = await t.signIn('lead@demo.test');
    const res = await lead.post('/api/campaigns/1/uploads').attach('files', archive, 'hidden-bomb.zip');
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('archive_ratio');
    expect(res.body.error.message).toMatch(/^hidden-bomb\.zip expands more than 200 times its size \((\d+) MB from the first (\d+) kB\); it looks like a zip bomb and was refused\. Nothing from this upload was stored\.$/);
    const [, expandedMb, readKb] = /\((\d+) MB from the first (\d+) kB\)/.exec(res.body.error.message)!;
    expect(Number(expandedMb)).toBeLessThan(64);
    expect(Number(readKb)).toBeLessThan(64);
    expect(rows(storedFiles)).toBe(before);
    expect(tmpFiles()).toEqual([]);
  });
});
