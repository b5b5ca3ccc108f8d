import { execFile } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { describe, expect, it } from 'vitest';
import { generateSyntheticSpectrum } from '../../../backend/src/spectra/generateSyntheticSpectrum';

const run = promisify(execFile);

/** `npm run scan -- …` without npm's banner: the same script under tsx. */
async function scan(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  try {
    const { stdout, stderr } = await run(process.execPath, ['--import', 'tsx', 'backend/src/cli/scan.ts', ...args], { timeout: 60_000 });
    return { code: 0, stdout, stderr };
  } catch (e) {
    const err = e as { code: number; stdout: string; stderr: string };
    return { code: err.code, stdout: err.stdout, stderr: err.stderr };
  }
}

describe('npm run scan (CLI)', () => {
  const dir = mkdtempSync(join(tmpdir(), 'redward-scan-cli-'));
  const s = generateSyntheticSpectrum({ class: 'galaxy', z: 0.42, snr: 10, seed: 3, pixels: 2175 });
  const good = join(dir, 'galaxy.csv');
  writeFileSync(good, ['wavelength,flux,ivar', ...Array.from(s.wavelength, (l, i) => `${l},${s.flux[i]},${s.mask[i] ? 0 : s.ivar[i]}`)].join('\n'));
  const broken = join(dir, 'broken.fits');
  writeFileSync(broken, 'SIMPLE  =                    T' + ' '.repeat(50) + 'not a FITS file');

  it('prints one JSON line per file, best solution first, and carries on past a bad file (exit 0)', async () => {
    const r = await scan([good, broken, join(dir, 'missing.csv'), '--zmax', '2', '--json']);
    expect(r.code).toBe(0);
    const lines = r.stdout.trim().split('\n').map((l) => JSON.parse(l));
    expect(lines).toHaveLength(3);
    expect(lines[0].ok).toBe(true);
    expect(lines[0].solutions[0].z).toBeCloseTo(0.42, 2);
    expect(lines[0].meta.step).toBe(1e-4);
    expect(lines[1]).toMatchObject({ file: broken, ok: false });
    expect(lines[1].error.code).toMatch(/^[a-z-]+$/);
    expect(lines[1].error.message.length).toBeGreaterThan(10);
    expect(lines[2]).toMatchObject({ ok: false, error: { code: 'ENOENT' } });
  });

  it('--step native scans on the file\'s own sampling (2e-4 dex here)', async () => {
    const r = await scan([good, '--step', 'native', '--zmax', '2']);
    const line = JSON.parse(r.stdout.trim());
    expect(line.meta.step).toBe(2e-4);
    expect(line.solutions[0].z).toBeCloseTo(0.42, 2);
  });

  it('reports pixels with non-finite values it ignored, and refuses an absurd wavelength naming its line', async () => {
    const rows = Array.from(s.wavelength, (l, i) => `${l},${i % 10 === 5 ? 'NaN' : i % 10 === 6 ? '1e308' : s.flux[i]},${s.mask[i] ? 0 : s.ivar[i]}`);
    const holes = join(dir, 'holes.csv');
    writeFileSync(holes, ['wavelength,flux,ivar', ...rows].join('\n'));
    const absurd = join(dir, 'absurd.csv');
    writeFileSync(absurd, ['wavelength,flux,ivar', ...rows.map((r, i) => (i === 99 ? r.replace(/^[^,]+/, '1e308') : r))].join('\n'));
    const r = await scan([holes, absurd, '--zmax', '2']);
    const [a, b] = r.stdout.trim().split('\n').map((l) => JSON.parse(l));
    expect(a.ok).toBe(true);
    expect(a.meta.ignoredPixels).toBe(434); // 2 of every 10 of the 2175 rows
    expect(a.meta.warnings).toContain('434 pixels with non-finite or absurd values ignored.');
    expect(a.meta.errorsEstimated).toBe(false);
    expect(a.solutions[0].z).toBeCloseTo(0.42, 2);
    expect(b).toEqual({
      file: absurd,
      ok: false,
      error: { code: 'bad-wavelength', message: 'Text table, line 101: the wavelength 1e+308 Å is outside 100 Å – 1 mm; every wavelength must lie between 100 Å and 1 mm (10⁷ Å).' },
    });
  });

  it('exits 2 with a usage line on a bad option', async () => {
    for (const args of [[good, '--step', 'fine'], [good, '--frobnicate'], []]) {
      const r = await scan(args);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(/^Usage: npm run scan/);
    }
  });
});
