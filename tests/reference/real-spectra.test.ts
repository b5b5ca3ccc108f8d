import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readSpectrum } from '../../backend/src/spectra/readSpectrum';
import { SpectrumReadError } from '../../backend/src/spectra/errors';
import { formatConfusion } from '../../backend/src/validation/confusionMatrix';
import { formatHalf, readManifest, REAL_SPECTRA_DIR, scoreRealSpectra, withinTolerance, type RealSpectraScore } from '../../backend/src/validation/realSpectraSplit';

// Real spectra with published redshifts: ../shared/real-spectra (README.md and MANIFEST.tsv there
// name each file's source and the paper or pipeline its redshift comes from). Parsing, the
// tuning/validation split and the scoring live in backend/src/validation/realSpectraSplit.ts,
// which `npm run accuracy` uses too.
const root = REAL_SPECTRA_DIR;
const manifest = readManifest(root);
const present = manifest !== undefined;
if (!present) console.warn(`Real-spectra tests skipped: ${root} is absent (it lives outside the repository).`);

interface Row { file: string; cls: string; z: number; reliable: boolean; tol: string }
const rows: Row[] = (manifest ?? []).map((r) => ({ file: r.file, cls: r.objectClass, z: r.referenceZ, reliable: r.reliable, tol: r.tolerance }));

// One scan per file, shared by the tests below (the reliable rows and the z ≈ 0 composites).
let scored: RealSpectraScore | undefined;
function score(): RealSpectraScore {
  scored ??= scoreRealSpectra(manifest ?? [], root);
  return scored;
}

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
    const result = score();
    for (const f of result.files.filter((x) => x.top1 !== undefined)) {
      const r = f.row;
      const top = f.solutions[0]!;
      const ok = withinTolerance(r, top.z);
      total++;
      if (ok) pass++;
      lines.push(`${ok ? 'ok ' : 'BAD'} ${f.half === 'tuning' ? 'T' : 'V'} ${r.file.padEnd(46)} ref ${r.referenceZ.toFixed(4).padStart(8)} top ${top.z.toFixed(4).padStart(8)} ${top.template}`);
    }
    // The two halves (T = tuning, V = validation; sha-256 of the file name, realSpectraSplit.ts):
    // printed so a change tuned on one half can be checked on the other. No per-half threshold.
    console.log([
      formatHalf('tuning half', result.tuning), formatHalf('validation half', result.validation),
      formatConfusion(result.tuning.confusion, `tuning half: true class × found class (${result.tuning.scanned} sources)`),
      formatConfusion(result.validation.confusion, `validation half: true class × found class (${result.validation.scanned} sources)`),
    ].join('\n'));
    const fraction = pass / total;
    console.log(`${lines.join('\n')}\nreliable rows within tolerance: ${pass}/${total} = ${(100 * fraction).toFixed(1)} %`);
    // Issue 3 asks for ≥ 95 %: 105/109 = 96.3 % with engine 0.5.3, which adds a quasar template
    // whose high-ionisation lines sit 5000 km/s blueward (PSOJ231-20_NIR, C IV ≈ 5000 km/s blueward
    // of its [C II] redshift, comes out at 6.564); 104/109 = 95.4 % with engine 0.5.2, whose Lyman-break template
    // without Lyα emission draws Lyα in absorption (the weak-lined quasar spec-5328, whose Lyα sits
    // in a damped absorber, comes out at its redshift instead of 0.0073 in Δz/(1+z) high);
    // 103/109 = 94.5 % with engine 0.5.0, whose emission-line galaxy may add a broad Balmer
    // component at z ≤ 0.5 (the broad-line AGN spec-8851 at z = 0.0018 no longer reads as a lone
    // [O II] at 0.76; docs/decisions/engine-scan.md lists the six left); 102/109 = 93.6 % with engine 0.4.2 (97 before: the telluric-corrected flux column of the XQ100
    // near-infrared arm is now read, cg922's rest-frame axis is put back to observed wavelengths from
    // its own header, and the quasar template's blueshifted, wider C IV group brings two z ≈ 6
    // near-infrared arms within tolerance; with 3 % of the sky added to σ, a lone sky-line residual
    // at 9310 Å no longer beats the M3 giant spec-4055 as [O II] at z = 1.50). spSpec-51630-0266-637 disagrees with its own data rather
    // than with the engine: Hα, [N II], [S II], Hβ and [O II] sit at z = 0.0847, and its header's
    // Z_CONF = 0.53 and Z_WARNIN = 4608 flag the catalogued 0.0880 as doubtful.
    expect(fraction).toBeGreaterThanOrEqual(0.95);
  }, 240_000); // scans every source once (≈ 155 files), reused by the next test

  it('rest-frame composites and cool-dwarf templates come out at z ≈ 0 with their class (table printed)', () => {
    const lines: string[] = [];
    let pass = 0;
    const chosen = rows.filter((r) => (r.file.startsWith('composites/') || r.file.startsWith('stars/')) && r.cls !== 'DOC');
    const scans = new Map(score().files.map((f) => [f.row.file, f]));
    for (const r of chosen) {
      const want = /STAR/.test(r.cls) ? ['star'] : /QSO/.test(r.cls) ? ['quasar'] : /LBG/.test(r.cls) ? ['lyman-break', 'galaxy'] : ['galaxy'];
      const top = scans.get(r.file)!.solutions[0]!;
      const ok = Math.abs(top.z) <= 0.005 && want.includes(top.class);
      if (ok) pass++;
      lines.push(`${ok ? 'ok ' : 'BAD'} ${r.file.padEnd(46)} want ${want.join('/').padEnd(18)} top z ${top.z.toFixed(4).padStart(8)} ${top.template}`);
    }
    console.log(`${lines.join('\n')}\nz ≈ 0 with the right class: ${pass}/${chosen.length}`);
    // Issue 3 asks for all of them. Guard at the level reached: 31/32 with engine 0.4.6, whose
    // continuum filter widens to ≈ 150 native pixels for coarsely sampled spectra (the SpeX L5, L8,
    // T5 and T8 dwarfs at R ≈ 120 now come out as stars), whose weights taper towards the data's
    // ends (the KC96 bulge is no longer read at z ≈ 1 from its red end) and whose running mean is
    // continued past the ends by point reflection (the SpeX M0 no longer reads as lines at the red
    // end); 25/32 before, 10/32 in engine 0.2. Still missed: Kesseli L3, whose own errors give
    // S/N ≈ 0.2–1 per 69 km/s pixel (checked: the scatter matches them): no template is detected
    // (best Δχ² ≈ 27 < 50), so the engine's class is "unknown", which is the honest answer.
    expect(pass).toBeGreaterThanOrEqual(31);
  });
});
