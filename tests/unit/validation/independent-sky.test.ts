import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readSpectrum } from '../../../backend/src/spectra/readSpectrum';
import { toVacuum } from '../../../backend/src/spectra/toVacuum';
import { fineGrid } from '../../../backend/src/validation/independentSky/fineGrid';
import { generateSkySpectrum } from '../../../backend/src/validation/independentSky/generateIndependentSky';
import { airToVacuum, vacuumToAir } from '../../../backend/src/validation/independentSky/physics';
import { createRandom } from '../../../backend/src/validation/independentSky/random';
import { carbonStar, CN_HEADS_AIR, SWAN_HEADS_AIR } from '../../../backend/src/validation/independentSky/starSources';
import { REAL_SPECTRA_DIR } from '../../../backend/src/validation/realSpectraSplit';

// The sky borrows shapes from ../shared/real-spectra (KC96 composites, dwarf standards).
const present = existsSync(join(REAL_SPECTRA_DIR, 'MANIFEST.tsv'));

describe('independent sky', () => {
  it('air ↔ vacuum (Edlén 1966, our own) agrees with the engine (Morton 2000) to 0.005 Å and round-trips', () => {
    // Hα: 6562.80 Å in air, 6564.61 in vacuum (NIST; from memory).
    expect(vacuumToAir(6564.61)).toBeCloseTo(6562.80, 1);
    for (const air of [3000, 5006.843, 6562.8, 9000, 20000]) {
      expect(Math.abs(airToVacuum(air) - toVacuum(air))).toBeLessThan(0.005);
      expect(vacuumToAir(airToVacuum(air))).toBeCloseTo(air, 8);
    }
  });

  it('carbon star: C2 Swan heads degrade to the blue, CN heads to the red (noiseless model)', () => {
    const g = fineGrid(4000, 9000);
    carbonStar(g, createRandom(7));
    const mean = (lo: number, hi: number) => {
      let s = 0, n = 0;
      for (let i = 0; i < g.lambda.length; i++) if (g.lambda[i]! >= lo && g.lambda[i]! <= hi) { s += g.flux[i]!; n++; }
      return s / n;
    };
    for (const air of SWAN_HEADS_AIR) {
      const h = airToVacuum(air);
      // τ₀ ≥ 0.6 just blueward of the head: the flux drops by ≥ 40 % across it.
      expect(mean(h - 8, h - 2) / mean(h + 2, h + 8), `Swan ${air}`).toBeLessThan(0.6);
    }
    for (const air of CN_HEADS_AIR) {
      const h = airToVacuum(air);
      expect(mean(h + 2, h + 8) / mean(h - 8, h - 2), `CN ${air}`).toBeLessThan(0.8);
    }
  });

  it.skipIf(!present)('is reproducible: the same seed and index give the same bytes, another seed others', () => {
    for (const k of [0, 3, 11]) {
      const a = generateSkySpectrum(42, k);
      const b = generateSkySpectrum(42, k);
      expect(Buffer.from(a.bytes).equals(Buffer.from(b.bytes))).toBe(true);
      expect(a.truth).toEqual(b.truth);
      expect(Buffer.from(generateSkySpectrum(43, k).bytes).equals(Buffer.from(a.bytes))).toBe(false);
    }
  }, 60_000); // generating a spectrum takes 0.1–0.4 s on a shared machine

  it.skipIf(!present)('quasar files read back with their length, medium and first wavelength', () => {
    const media = new Set<string>();
    const layouts = new Set<string>();
    for (let k = 0; k < 10; k++) {
      const { truth, bytes } = generateSkySpectrum(5, k, 'quasar');
      const s = readSpectrum(bytes);
      expect(truth.class).toBe('quasar');
      expect(s.wavelength.length, truth.file).toBe(truth.pixels);
      expect(s.meta.medium, truth.file).toBe(truth.medium);
      expect(s.meta.mediumFrom, truth.file).toBe('header');
      const first = truth.medium === 'air' ? vacuumToAir(truth.lambdaMin) : truth.lambdaMin;
      expect(Math.abs(s.wavelength[0]! - first), truth.file).toBeLessThan(0.01);
      media.add(truth.medium);
      layouts.add(truth.layout);
    }
    // The ten draws cover both media and at least three layouts, so the checks above mean something.
    expect(media.size).toBe(2);
    expect(layouts.size).toBeGreaterThanOrEqual(3);
  }, 60_000);

  it.skipIf(!present)('every quasar window holds Lyα and ≥ 200 Å of continuum redward of it; fluxes stay finite and sane', () => {
    // Seed 31 #378 (z = 6.98, 4112–8733 Å) was all Gunn–Peterson trough, and its normalisation to a
    // continuum of 5 blew the last light up to 2.7e29 (engine χ² ≈ 1e24).
    for (const k of [378, 84, 186]) {
      const { truth, bytes } = generateSkySpectrum(31, k);
      expect(truth.kind, `#${k}`).toBe('quasar');
      expect(truth.lambdaMax, `#${k}`).toBeGreaterThan(1215.67 * (1 + truth.z) + 200);
      const s = readSpectrum(bytes);
      let peak = 0;
      for (const f of s.flux) peak = Math.max(peak, Math.abs(f));
      expect(peak, `#${k}`).toBeLessThan(1e4);
    }
  }, 60_000);
});
