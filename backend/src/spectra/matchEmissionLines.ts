import { LINES } from './lineList';
import type { PreparedSpectrum } from './prepareSpectrum';

/** A significant emission peak found by the matched filter. */
export interface EmissionPeak {
  /** Observed vacuum wavelength, Å. */
  wavelength: number;
  /** Matched-filter signal-to-noise. */
  snr: number;
}

/** A redshift explained by two or more peaks. */
export interface LineMatch {
  z: number;
  lines: Array<{ name: string; rest: number; observed: number; snr: number }>;
}

/** What a lone line could be, and what would tell the options apart. */
export interface SingleLineAlternative {
  line: string;
  z: number;
  separator: string;
  /** Other lines this interpretation predicts inside the observed range. */
  expectedInRange: string[];
}

export interface LineMatchResult {
  peaks: EmissionPeak[];
  matches: LineMatch[];
  /** Present when only one significant line is seen (or none of the peaks pair up). */
  singleLine?: { wavelength: number; snr: number; alternatives: SingleLineAlternative[] };
}

/** Strong emission features for pairing; close doublets are merged (flux-weighted). */
const PAIR_LINES = mergeDoublets();

const SINGLE_ALTERNATIVES: Array<{ name: string; rest: number; separator: string; partners: string[] }> = [
  { name: '[O II] 3727,3730', rest: 3728.5, separator: 'a resolved 3727/3730 doublet (2.8 Å apart at rest, needs R ≳ 3000) and a 4000 Å break redward', partners: ['[Ne III] 3870', 'H-beta', '[O III] 5008', 'H-alpha'] },
  { name: 'Ly-alpha', rest: 1215.67, separator: 'an asymmetric profile with a sharp blue edge and the continuum dropping blueward (IGM)', partners: ['C IV 1548', 'C III] 1909', 'N V 1239'] },
  { name: 'H-alpha', rest: 6564.607, separator: '[N II] 6550/6585 flanking the line and [S II] 6718/6733 just redward', partners: ['[N II] 6585', '[S II] 6718', 'H-beta', '[O III] 5008'] },
  { name: '[O III] 5008', rest: 5008.24, separator: '[O III] 4960 at one third of the flux 48 Å (rest) blueward, Hβ further blueward', partners: ['[O III] 4960', 'H-beta', 'H-alpha', '[O II] 3727'] },
  { name: 'H-beta', rest: 4862.68, separator: '[O III] 4960/5008 redward of it', partners: ['[O III] 5008', '[O III] 4960', 'H-alpha', '[O II] 3727'] },
];

function mergeDoublets(): Array<{ name: string; rest: number }> {
  const strong = LINES.filter((l) => l.kind === 'emission' && Math.max(l.strength['galaxy-emission'] ?? 0, l.strength['quasar'] ?? 0) >= 0.08);
  const out: Array<{ name: string; rest: number; w: number }> = [];
  for (const l of strong) {
    const w = Math.max(l.strength['galaxy-emission'] ?? 0, l.strength['quasar'] ?? 0);
    const prev = out[out.length - 1];
    if (prev && l.rest - prev.rest < 4) {
      prev.rest = (prev.rest * prev.w + l.rest * w) / (prev.w + w);
      prev.w += w;
      prev.name = `${prev.name}+${l.name}`;
    } else out.push({ name: l.name, rest: l.rest, w });
  }
  return out.map(({ name, rest }) => ({ name, rest }));
}

/**
 * Second, explainable route to a redshift: a matched filter (Gaussian of the instrument width on
 * the continuum-removed flux, weighted by ivar) finds significant emission peaks; every pair of
 * peaks whose wavelength ratio equals a ratio of rest wavelengths of strong lines gives a
 * redshift, and redshifts explained by several pairs are merged. A lone line gets the standard
 * alternatives ([O II], Lyα, Hα, [O III], Hβ) with what would separate them.
 */
export function matchEmissionLines(prepared: PreparedSpectrum, range: { zMin: number; zMax: number }, minSnr = 6): LineMatchResult {
  const { n, flux, ivar, step, g0 } = prepared;
  const sigma = Math.max(1, prepared.instrumentSigmaPx * 1.3);
  const half = Math.ceil(3 * sigma);
  const kernel: number[] = [];
  for (let k = -half; k <= half; k++) kernel.push(Math.exp(-0.5 * (k / sigma) ** 2));
  const snr = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let num = 0;
    let den = 0;
    for (let k = -half; k <= half; k++) {
      const j = i + k;
      if (j < 0 || j >= n) continue;
      const g = kernel[k + half]!;
      num += ivar[j]! * flux[j]! * g;
      den += ivar[j]! * g * g;
    }
    snr[i] = den > 0 ? num / Math.sqrt(den) : 0;
  }
  const peaks: EmissionPeak[] = [];
  for (let i = 1; i < n - 1; i++) {
    if (snr[i]! < minSnr || snr[i]! < snr[i - 1]! || snr[i]! < snr[i + 1]!) continue;
    let isMax = true;
    for (let k = -Math.ceil(3 * sigma); k <= Math.ceil(3 * sigma) && isMax; k++) if (i + k >= 0 && i + k < n && snr[i + k]! > snr[i]!) isMax = false;
    if (isMax) peaks.push({ wavelength: 10 ** ((g0 + i) * step), snr: snr[i]! });
  }
  peaks.sort((a, b) => b.snr - a.snr);
  const top = peaks.slice(0, 15);
  const tol = 2.5 * sigma * step * Math.LN10;
  const candidates: Array<{ z: number; a: number; b: number; la: number; lb: number }> = [];
  for (let i = 0; i < top.length; i++) for (let j = 0; j < top.length; j++) {
    if (top[j]!.wavelength <= top[i]!.wavelength) continue;
    const ratio = top[j]!.wavelength / top[i]!.wavelength;
    for (let a = 0; a < PAIR_LINES.length; a++) for (let b = a + 1; b < PAIR_LINES.length; b++) {
      if (Math.abs(Math.log(ratio / (PAIR_LINES[b]!.rest / PAIR_LINES[a]!.rest))) > tol) continue;
      const z = top[i]!.wavelength / PAIR_LINES[a]!.rest - 1;
      if (z >= range.zMin && z <= range.zMax) candidates.push({ z, a: i, b: j, la: a, lb: b });
    }
  }
  const matches: LineMatch[] = [];
  for (const c of candidates) {
    let m = matches.find((x) => Math.abs(x.z - c.z) / (1 + c.z) < 0.002);
    if (!m) {
      m = { z: c.z, lines: [] };
      matches.push(m);
    }
    for (const [p, l] of [[c.a, c.la], [c.b, c.lb]] as const) {
      if (!m.lines.some((x) => x.name === PAIR_LINES[l]!.name)) {
        m.lines.push({ name: PAIR_LINES[l]!.name, rest: PAIR_LINES[l]!.rest, observed: top[p]!.wavelength, snr: top[p]!.snr });
      }
    }
  }
  for (const m of matches) {
    let wsum = 0;
    let zsum = 0;
    for (const l of m.lines) {
      zsum += (l.observed / l.rest - 1) * l.snr;
      wsum += l.snr;
    }
    m.z = zsum / wsum;
    m.lines.sort((a, b) => a.rest - b.rest);
  }
  matches.sort((a, b) => b.lines.reduce((s, l) => s + l.snr, 0) - a.lines.reduce((s, l) => s + l.snr, 0));
  const result: LineMatchResult = { peaks: top, matches };
  const lone = top[0];
  if (lone && (top.length === 1 || matches.length === 0)) {
    result.singleLine = {
      wavelength: lone.wavelength,
      snr: lone.snr,
      alternatives: SINGLE_ALTERNATIVES.map((alt) => {
        const z = lone.wavelength / alt.rest - 1;
        const expectedInRange = alt.partners.filter((p) => {
          const line = LINES.find((l) => l.name === p);
          const obs = line ? line.rest * (1 + z) : NaN;
          return obs >= prepared.wavelengthMin && obs <= prepared.wavelengthMax;
        });
        return { line: alt.name, z, separator: alt.separator, expectedInRange };
      }).filter((a) => a.z >= range.zMin && a.z <= range.zMax),
    };
  }
  return result;
}
