import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { readSpectrum } from '../../backend/src/spectra/readSpectrum';
import { SpectrumReadError } from '../../backend/src/spectra/errors';
import { scanSpectrum } from '../../backend/src/spectra/scanSpectrum';

// Real spectra with published redshifts: ../shared/real-spectra (README.md and MANIFEST.tsv there
// name each file's source and the paper or pipeline its redshift comes from).
const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..', '..', 'shared', 'real-spectra');
const present = existsSync(join(root, 'MANIFEST.tsv'));
if (!present) console.warn(`Real-spectra tests skipped: ${root} is absent (it lives outside the repository).`);

interface Row { file: string; cls: string; z: number; reliable: boolean; tol: string }
const rows: Row[] = present
  ? readFileSync(join(root, 'MANIFEST.tsv'), 'utf8').trim().split('\n').slice(1).map((l) => {
      const c = l.split('\t');
      return { file: c[0]!, cls: c[4]!, z: Number(c[5]), reliable: c[8] === 'yes', tol: c[9]! };
    })
  : [];

describe.skipIf(!present)('real spectra in ../shared/real-spectra', () => {
  it('every spectrum file reads without error (the documentation file gives a typed error)', () => {
    const listed = new Set(rows.map((r) => r.file));
    const onDisk = readdirSync(root, { recursive: true, withFileTypes: true }).filter((d) => d.isFile() && d.name !== 'MANIFEST.tsv' && d.name !== 'README.md');
    expect(onDisk.length).toBe(listed.size);
    let read = 0;
    for (const r of rows) {
      const bytes = new Uint8Array(readFileSync(join(root, r.file)));
      if (r.cls === 'DOC') {
        expect(() => readSpectrum(bytes)).toThrowError(SpectrumReadError);
        continue;
      }
      const s = readSpectrum(bytes);
      expect(s.wavelength.length, r.file).toBeGreaterThan(100);
      read++;
    }
    expect(read).toBe(rows.length - 1);
  });

  it('top solution within the tolerance for reliable rows (table printed)', () => {
    const lines: string[] = [];
    let pass = 0;
    let total = 0;
    for (const r of rows.filter((x) => x.reliable)) {
      const res = scanSpectrum(readSpectrum(new Uint8Array(readFileSync(join(root, r.file)))));
      const top = res.solutions[0]!;
      const tol = parseFloat(r.tol);
      const ok = r.tol.endsWith('rel') ? Math.abs(top.z - r.z) / (1 + r.z) <= tol : Math.abs(top.z - r.z) <= tol;
      total++;
      if (ok) pass++;
      lines.push(`${ok ? 'ok ' : 'BAD'} ${r.file.padEnd(46)} ref ${r.z.toFixed(4).padStart(8)} top ${top.z.toFixed(4).padStart(8)} ${top.template}`);
    }
    const fraction = pass / total;
    console.log(`${lines.join('\n')}\nreliable rows within tolerance: ${pass}/${total} = ${(100 * fraction).toFixed(1)} %`);
    // The product target is ≥ 95 % (issue 3); this guards the level reached so far (79.8 % when
    // written) against regressions until the template set is improved.
    expect(fraction).toBeGreaterThanOrEqual(0.78);
  });
});
