import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { linesForClass } from '../../backend/src/spectra/linesForClass';
import { lineFwhmForClass, measureCombLines, type LineMeasurement } from '../../backend/src/spectra/measureCombLines';
import { readSpectrum } from '../../backend/src/spectra/readSpectrum';
import { resolutionElement } from '../../backend/src/spectra/resolutionElement';
import { toVacuumArray } from '../../backend/src/spectra/toVacuum';
import { classFamily, readManifest, REAL_SPECTRA_DIR } from '../../backend/src/validation/realSpectraSplit';

// The comb's lines measured on the real spectra of ../shared/real-spectra at their published
// redshifts (MANIFEST.tsv names each file's source and where its z comes from: for the SDSS files,
// the SDSS pipeline redshift in the file). Nothing derived from these files is committed: the
// checks read them at run time.
const manifest = readManifest(REAL_SPECTRA_DIR);
const present = manifest !== undefined;

interface Measured { file: string; cls: string; lines: LineMeasurement[] }
let cache: Measured[] | undefined;
function measureAll(): Measured[] {
  cache ??= (manifest ?? [])
    .filter((r) => r.reliable && classFamily(r.objectClass) !== undefined)
    .map((r) => {
      const cls = classFamily(r.objectClass)!;
      const s = readSpectrum(new Uint8Array(readFileSync(join(REAL_SPECTRA_DIR, r.file))));
      const wavelength = s.meta.medium === 'air' ? toVacuumArray(s.wavelength) : s.wavelength;
      const lines = measureCombLines(
        { wavelength, flux: s.flux, ivar: s.ivar, mask: s.mask },
        { z: r.referenceZ, lines: linesForClass(cls), resolutionFwhmKms: resolutionElement(wavelength).fwhmKms, lineFwhmKms: lineFwhmForClass(cls) },
      );
      return { file: r.file, cls, lines };
    });
  return cache;
}

describe.skipIf(!present)('comb lines measured on the real spectra', () => {
  it('every reliable spectrum is measured, with finite numbers or nulls only, and some lines detected', () => {
    const all = measureAll();
    expect(all.length).toBeGreaterThan(100);
    for (const { file, lines } of all) {
      for (const m of lines) {
        for (const v of [m.flux, m.fluxErr, m.ewRest, m.ewRestErr, m.breakRatio, m.breakRatioErr, m.snr, m.offsetKms, m.offsetErrKms]) {
          if (v !== null) expect(Number.isFinite(v), `${file} ${m.name}`).toBe(true);
        }
      }
    }
    const withDetections = all.filter((f) => f.lines.some((m) => m.detected)).length;
    console.info(`real spectra: ${withDetections}/${all.length} with a detected line at the published z`);
    expect(withDetections / all.length).toBeGreaterThan(0.9);
  });

  it('the narrow emission lines of SDSS galaxies sit at the pipeline redshift: offsets of lines at S/N ≥ 10', () => {
    const offsets = measureAll()
      .filter((f) => f.cls === 'galaxy' && f.file.startsWith('sdss'))
      .flatMap((f) => f.lines.filter((m) => m.kind === 'emission' && m.detected && m.snr! >= 10 && m.blendedWith.length === 0).map((m) => m.offsetKms!));
    const abs = offsets.map(Math.abs).sort((a, b) => a - b);
    const median = abs[abs.length >> 1]!;
    console.info(`SDSS galaxy emission lines at S/N ≥ 10: n = ${abs.length}, median |offset| ${median.toFixed(1)} km/s, 90th percentile ${abs[Math.floor(abs.length * 0.9)]!.toFixed(1)} km/s`);
    expect(abs.length).toBeGreaterThan(30);
    // The pipeline redshift is a fit to all lines at once, so single lines scatter by tens of km/s about it.
    expect(median).toBeLessThan(40);
  });
});
