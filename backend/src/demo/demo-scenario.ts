import type { TemplateClass } from '../spectra/types';
import { gaussianFrom, mulberry32 } from '../spectra/seededRandom';

/**
 * The invented demo campaigns' targets and what their spectra really are. Every name, position
 * and redshift here is made up; the cluster "Lantern" and the "Tidewater Deep Field" do not exist.
 */
export interface DemoTarget {
  id: string;
  ra: number;
  dec: number;
  mag: number;
  /** What the synthetic spectrum is made from (null: no usable signal). */
  truth: { class: TemplateClass; template: string; z: number; snr: number } | null;
  photoZ: number;
  family?: string;
  priority: number;
  instrument: string;
}

/** Seeded PRNG (mulberry32) so the demo is the same on every machine. */
export function seeded(seed: number) {
  const next = mulberry32(seed);
  const gauss = gaussianFrom(next);
  return { next, gauss, between: (lo: number, hi: number) => lo + (hi - lo) * next() };
}

const round = (v: number, digits: number) => Number(v.toFixed(digits));

function build(centre: { ra: number; dec: number }, seed: number, groups: Group[]): DemoTarget[] {
  const r = seeded(seed);
  const out: DemoTarget[] = [];
  for (const g of groups) {
    for (let i = 0; i < g.count; i++) {
      const truth = g.truth ? g.truth(r, i) : null;
      const z = truth?.z ?? r.between(0, 6);
      // Photometric redshifts scatter by ~5 % in (1+z); contaminants sit where they fool the colours.
      const photoZ = g.photoZ ? g.photoZ(r) : Math.max(0.01, z + 0.05 * (1 + z) * r.gauss());
      out.push({
        id: g.id(i),
        ra: round(centre.ra + r.between(-0.03, 0.03), 6),
        dec: round(centre.dec + r.between(-0.03, 0.03), 6),
        mag: round(r.between(g.mag[0], g.mag[1]), 2),
        truth,
        photoZ: round(photoZ, 3),
        ...(g.family ? { family: g.family } : {}),
        priority: g.priority,
        instrument: g.instrument,
      });
    }
  }
  return out;
}

interface Group {
  count: number;
  id: (i: number) => string;
  truth: ((r: ReturnType<typeof seeded>, i: number) => DemoTarget['truth']) | null;
  photoZ?: (r: ReturnType<typeof seeded>) => number;
  family?: string;
  priority: number;
  mag: [number, number];
  instrument: string;
}

const pad = (i: number) => String(i + 1).padStart(2, '0');

/** Lantern Cluster arcs: three multiple-image families, cluster members, interlopers, contaminants. */
export const LANTERN_TARGETS: readonly DemoTarget[] = [
  ...build({ ra: 160.5146, dec: -11.6333 }, 41, [
    // A triply imaged Lyman-break source with Lyα emission: the campaign's prize.
    { count: 3, id: (i) => `LNT-A1.${i + 1}`, truth: () => ({ class: 'lyman-break', template: 'lyman-break-lya', z: 6.143, snr: 6 }), family: 'A1', priority: 1, mag: [25.4, 26.3], instrument: 'demo-grism' },
    { count: 2, id: (i) => `LNT-B2.${i + 1}`, truth: () => ({ class: 'galaxy', template: 'galaxy-emission', z: 2.317, snr: 7 }), family: 'B2', priority: 1, mag: [23.8, 24.6], instrument: 'demo-grism' },
    { count: 3, id: (i) => `LNT-C3.${i + 1}`, truth: () => ({ class: 'galaxy', template: 'galaxy-emission', z: 1.288, snr: 9 }), family: 'C3', priority: 1, mag: [22.9, 23.7], instrument: 'demo-slit' },
    { count: 15, id: (i) => `LNT-M${pad(i)}`, truth: (r) => ({ class: 'galaxy', template: 'galaxy-absorption', z: round(0.41 + 0.004 * r.gauss(), 4), snr: r.between(6, 15) }), priority: 3, mag: [19.5, 22], instrument: 'demo-slit' },
    { count: 20, id: (i) => `LNT-S${pad(i)}`, truth: (r) => ({ class: 'galaxy', template: 'galaxy-emission', z: round(r.between(0.55, 1.45), 4), snr: r.between(3, 12) }), priority: 2, mag: [22.5, 25], instrument: 'demo-slit' },
    { count: 6, id: (i) => `LNT-F${pad(i)}`, truth: (r) => ({ class: 'galaxy', template: 'galaxy-emission', z: round(r.between(0.08, 0.3), 4), snr: r.between(8, 20) }), priority: 3, mag: [20, 22], instrument: 'demo-slit' },
    { count: 2, id: (i) => `LNT-Q${pad(i)}`, truth: (r) => ({ class: 'quasar', template: 'quasar', z: round(r.between(2.6, 3.1), 4), snr: 12 }), priority: 2, mag: [20.5, 21.5], instrument: 'demo-slit' },
    { count: 5, id: (i) => `LNT-X${pad(i)}`, truth: () => ({ class: 'star', template: 'star-cool', z: 0, snr: 10 }), photoZ: (r) => r.between(5.8, 6.6), priority: 2, mag: [24, 25.5], instrument: 'demo-grism' },
    { count: 4, id: (i) => `LNT-U${pad(i)}`, truth: null, priority: 3, mag: [26, 27], instrument: 'demo-grism' },
  ]),
  ...faintArcTargets({ ra: 160.5146, dec: -11.6333 }),
];

/**
 * One faint lensed arc at S/N ≈ 2 per pixel in the grism (2.1 in its best tenth as generated, medianSnrPerPixel of the client): what a reader meets at the detection
 * limit (smoothed by default, most comb labels competing for room). Built from its own seed after
 * the other targets, so adding it moved none of them.
 */
function faintArcTargets(centre: { ra: number; dec: number }): DemoTarget[] {
  return build(centre, 43, [{ count: 1, id: () => 'LNT-W01', truth: () => ({ class: 'lyman-break', template: 'lyman-break-lya', z: 4.372, snr: 1.8 }), priority: 3, mag: [26.4, 26.8], instrument: 'demo-grism' }]);
}

/** Tidewater Deep Field dropouts: Lyman-break sources, low-redshift interlopers and cool dwarfs. */
export const TIDEWATER_TARGETS = build({ ra: 214.3021, dec: 8.7142 }, 77, [
  { count: 22, id: (i) => `TDF-${String(i + 1).padStart(4, '0')}`, truth: (r, i) => ({ class: 'lyman-break', template: i % 2 === 0 ? 'lyman-break-lya' : 'lyman-break', z: round(r.between(5.5, 7.0), 4), snr: r.between(3, 8) }), priority: 1, mag: [25, 27], instrument: 'demo-grism' },
  { count: 14, id: (i) => `TDF-${String(i + 101).padStart(4, '0')}`, truth: (r) => ({ class: 'galaxy', template: 'galaxy-absorption', z: round(r.between(1.0, 1.5), 4), snr: r.between(4, 10) }), photoZ: (r) => r.between(5.5, 6.5), priority: 2, mag: [24, 26], instrument: 'demo-grism' },
  { count: 10, id: (i) => `TDF-${String(i + 201).padStart(4, '0')}`, truth: (r) => ({ class: 'galaxy', template: 'galaxy-emission', z: round(r.between(0.3, 1.4), 4), snr: r.between(4, 12) }), priority: 2, mag: [23, 25], instrument: 'demo-grism' },
  { count: 9, id: (i) => `TDF-${String(i + 301).padStart(4, '0')}`, truth: () => ({ class: 'star', template: 'star-cool', z: 0, snr: 9 }), photoZ: (r) => r.between(5.6, 6.8), priority: 2, mag: [24, 25.5], instrument: 'demo-grism' },
  { count: 5, id: (i) => `TDF-${String(i + 401).padStart(4, '0')}`, truth: null, priority: 3, mag: [26.5, 27.5], instrument: 'demo-grism' },
]);

/**
 * The catalogue file a lead of each demo campaign would upload; with `photometry`, also each
 * target's band fluxes as `flux_<filter>` and `err_<filter>` columns in nJy.
 */
export function demoCatalogueCsv(targets: readonly DemoTarget[], photometry?: { filters: readonly string[]; fluxes: ReadonlyArray<{ flux: number[]; err: number[] }> }): string {
  const bandHeader = photometry ? photometry.filters.flatMap((f) => [`flux_${f}`, `err_${f}`]) : [];
  const lines = [['id,ra,dec,mag,zphot,zphot_l68,zphot_u68,family,priority', ...bandHeader].join(',')];
  targets.forEach((t, i) => {
    const width = 0.08 * (1 + t.photoZ);
    const bands = photometry ? photometry.filters.flatMap((_, b) => [photometry.fluxes[i]!.flux[b], photometry.fluxes[i]!.err[b]]) : [];
    lines.push([t.id, t.ra, t.dec, t.mag, t.photoZ, round(Math.max(0, t.photoZ - width), 3), round(t.photoZ + width, 3), t.family ?? '', t.priority, ...bands].join(','));
  });
  return lines.join('\n') + '\n';
}
