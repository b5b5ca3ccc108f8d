import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { loadShippedFilters } from '../../backend/src/cli/photoz-data';
import { buildPhotoZTemplates } from '../../backend/src/photoz/analyticTemplates';
import { abMagnitude, bandAverageFnu } from '../../backend/src/photoz/photometry';
import { gridWavelengths, REST_GRID, restSedOnGrid } from '../../backend/src/photoz/restTemplates';
import { readSpectrum } from '../../backend/src/spectra/readSpectrum';

/**
 * Our analytical photo-z templates against real spectra, by broad-band colour. The real files are
 * test data only (../shared/real-spectra/README.md): they are read here and never shipped.
 * Sources: Kinney et al. (1996, ApJ 467, 38) composites; Kesseli et al. (2017, ApJS 230, 16)
 * optical dwarf templates joined at 9000 Å to SpeX prism spectral standards (MANIFEST.tsv).
 * Tolerance 0.15 mag per colour (common practice: the scatter of one galaxy type's colours, and
 * what a broad-band fit with a 3 % error floor can tell apart).
 */
const realDir = join(dirname(fileURLToPath(import.meta.url)), '..', '..', '..', 'shared', 'real-spectra');
const TOLERANCE_MAG = 0.15;
const set = buildPhotoZTemplates();
const lam = gridWavelengths(REST_GRID);

function ours(id: string): Float64Array {
  const t = set.templates.find((x) => x.id === id);
  if (!t) throw new Error(`no template ${id}`);
  return t.fnu;
}

function readReal(rel: string): { w: Float64Array; f: Float64Array } {
  const s = readSpectrum(new Uint8Array(readFileSync(join(realDir, rel))));
  return { w: s.wavelength, f: Float64Array.from(s.flux, (v, i) => (s.mask[i] ? NaN : v)) };
}

/** A real spectrum (or an optical one joined at 9000 Å to an infrared one, scaled on 8000–9000 Å) on REST_GRID. */
function real(files: string[]): Float64Array {
  if (files.length === 1) {
    const s = readReal(files[0]!);
    return restSedOnGrid(s.w, s.f, { blue: 'zero', red: 'rayleigh-jeans' }).fnu;
  }
  const [o, r] = files.map(readReal) as [ReturnType<typeof readReal>, ReturnType<typeof readReal>];
  const median = (s: typeof o) => {
    const v = Array.from(s.f).filter((x, i) => Number.isFinite(x) && s.w[i]! >= 8000 && s.w[i]! <= 9000).sort((a, b) => a - b);
    return v[v.length >> 1]!;
  };
  const k = median(o) / median(r);
  const w: number[] = [];
  const f: number[] = [];
  o.w.forEach((l, i) => { if (l < 9000) { w.push(l); f.push(o.f[i]!); } });
  r.w.forEach((l, i) => { if (l >= 9000) { w.push(l); f.push(r.f[i]! * k); } });
  return restSedOnGrid(Float64Array.from(w), Float64Array.from(f), { blue: 'zero', red: 'rayleigh-jeans' }).fnu;
}

/** AB colours of consecutive bands for a rest-frame f_ν seen at redshift z. */
function colours(fnu: Float64Array, bands: string[], z = 0): number[] {
  const curves = loadShippedFilters(bands);
  const observed = Float64Array.from(lam, (l) => l * (1 + z));
  const m = curves.map((c) => abMagnitude(bandAverageFnu(c, observed, fnu).fnu));
  return m.slice(1).map((x, i) => m[i]! - x);
}

/** Largest |Δ colour|, mag. */
function worst(a: number[], b: number[]): number {
  return Math.max(...a.map((x, i) => Math.abs(x - b[i]!)));
}

// Bands inside the real data: KC96 spans 1235 Å – 1 µm (u…i at z = 0, g…z at z = 0.3); the
// joined dwarfs 3650 Å – 2.56 µm (r…Ks), SpeX alone 0.65 – 2.56 µm (J, H, Ks).
const UGRI = ['sdss_u0', 'sdss_g0', 'sdss_r0', 'sdss_i0'];
const GRIZ = ['sdss_g0', 'sdss_r0', 'sdss_i0', 'sdss_z0'];
const RIZJHK = ['sdss_r0', 'sdss_i0', 'sdss_z0', 'twomass_J', 'twomass_H', 'twomass_Ks'];
const JHK = ['twomass_J', 'twomass_H', 'twomass_Ks'];

describe.skipIf(!existsSync(realDir))(`analytical photo-z templates have the colours of real spectra (within ${TOLERANCE_MAG} mag)`, () => {
  // Measured when written (ours − real, mag): lowz-old vs E u−g −0.10, g−r +0.11, r−i +0.03
  // (z = 0.3: −0.11, +0.08, +0.09); lowz-early vs Sa −0.06, +0.06, +0.04 (z = 0.3: +0.02, +0.04, +0.05).
  it.each([
    ['lowz-old', 'composites/KC96_elliptical_template.fits'],
    ['lowz-early', 'composites/KC96_sa_template.fits'],
  ])('%s vs %s: u−g, g−r, r−i at z = 0 and g−r, r−i, i−z at z = 0.3', (id, file) => {
    const r = real([file]);
    expect(worst(colours(ours(id), UGRI), colours(r, UGRI))).toBeLessThan(TOLERANCE_MAG);
    expect(worst(colours(ours(id), GRIZ, 0.3), colours(r, GRIZ, 0.3))).toBeLessThan(TOLERANCE_MAG);
  });

  it('the check can fail: the elliptical template is not an Sc (u−g differs by > 1 mag)', () => {
    const sc = real(['composites/KC96_sc_template.fits']);
    expect(worst(colours(ours('lowz-old'), UGRI), colours(sc, UGRI))).toBeGreaterThan(1);
  });

  // The M0 dwarf agrees except in J−H (measured, ours − real: r−i −0.05, i−z +0.01, z−J −0.08,
  // J−H −0.20, H−Ks +0.10); the cooler engine dwarfs are blackbodies with band opacities tuned for continuum-removed
  // spectral fits and miss the real broad-band shape, by up to 1.7 mag (T5 J−H +1.74). These are
  // recorded as known failures: `it.fails` passes while the gap is there and turns red when a
  // better recipe closes it, so the entry must then move to the passing list.
  it('star-M0 vs the real M0 dwarf: r−i, i−z, z−J, H−Ks within tolerance', () => {
    const c = colours(ours('star-M0'), RIZJHK);
    const r = colours(real(['stars/Kesseli2017_M0_+0.0_Dwarf.fits', 'stars/SpeXstd_M0_11335_10505.fits']), RIZJHK);
    for (const k of [0, 1, 2, 4]) expect(Math.abs(c[k]! - r[k]!), `${RIZJHK[k]}−${RIZJHK[k + 1]}`).toBeLessThan(TOLERANCE_MAG);
  });

  it.fails.each([
    ['star-M0', ['stars/Kesseli2017_M0_+0.0_Dwarf.fits', 'stars/SpeXstd_M0_11335_10505.fits'], RIZJHK], // J−H −0.20
    ['star-M4', ['stars/Kesseli2017_M5_+0.0_Dwarf.fits', 'stars/SpeXstd_M5_10829_10104.fits'], RIZJHK], // r−i −0.72 (vs M5)
    ['star-M8', ['stars/Kesseli2017_M9.fits', 'stars/SpeXstd_M9_10821_11058.fits'], RIZJHK], // r−i −1.65 (vs M9)
    ['star-L2', ['stars/SpeXstd_L2_10600_10957.fits'], JHK], // J−H +0.22
    ['star-L7', ['stars/SpeXstd_L8_10115_11254.fits'], JHK], // J−H +0.46 (vs L8)
    ['star-T5', ['stars/SpeXstd_T5_10021_11106.fits'], JHK], // J−H +1.74
  ] as const)('known gap: %s vs %s', (id, files, bands) => {
    expect(worst(colours(ours(id), [...bands]), colours(real([...files]), [...bands]))).toBeLessThan(TOLERANCE_MAG);
  });
});
