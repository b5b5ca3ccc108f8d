import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { generateSyntheticSpectrum } from '../spectra/generateSyntheticSpectrum';
import { readSpectrum } from '../spectra/readSpectrum';
import { prepareSpectrum } from '../spectra/prepareSpectrum';
import { scanSpectrum, type Solution } from '../spectra/scanSpectrum';
import type { SpectrumClass, TemplateClass } from '../spectra/types';
import { countConfusion, emptyConfusion, formatConfusion, type ConfusionMatrix } from '../validation/confusionMatrix';
import { writeIndependentSky, type SkyTruth } from '../validation/independentSky/generateIndependentSky';
import { bestLineSnr, LINE_DETECTION_SIGMA } from '../validation/lineVisibility';
import { formatHalf, readManifest, scoreRealSpectra, type HalfScore } from '../validation/realSpectraSplit';

// `npm run accuracy -- [--quick] [--json] [--only real,generator,sky] [--per-case N] [--sky N] [--seed S] [--keep DIR] [--misses]`
// (i) the real spectra, tuning and validation halves; (ii) the engine's own synthetic generator per
// class and S/N; (iii) the independent sky (backend/src/validation/independentSky). Seeded, reproducible.
const args = process.argv.slice(2);
const flag = (name: string) => args.includes(name);
function option(name: string): string | undefined {
  const i = args.indexOf(name);
  if (i < 0) return undefined;
  const v = args[i + 1];
  if (v === undefined || v.startsWith('--')) usage(`${name} needs a value`);
  return v;
}
function count(name: string, fallback: number): number {
  const v = option(name);
  if (v === undefined) return fallback;
  const n = Number(v);
  if (!Number.isInteger(n) || n < 1) usage(`${name} needs a positive whole number`);
  return n;
}
const known = new Set(['--quick', '--json', '--misses', '--only', '--per-case', '--sky', '--seed', '--keep']);
for (let i = 0; i < args.length; i++) {
  if (!known.has(args[i]!)) usage(`unknown argument ${args[i]}`);
  if (!['--quick', '--json', '--misses'].includes(args[i]!)) i++;
}
const quick = flag('--quick');
const json = flag('--json');
const only = new Set((option('--only') ?? 'real,generator,sky').split(','));
for (const s of only) if (!['real', 'generator', 'sky'].includes(s)) usage(`--only takes real, generator and/or sky, not ${s}`);
const perCase = count('--per-case', quick ? 8 : 40);
const skyCount = count('--sky', quick ? 60 : 1000);
const seed = count('--seed', 2024);
const keep = option('--keep');
const listMisses = flag('--misses');

/** |Δz|/(1 + z) ≤ 0.002: the redshift is right (the engine's tolerance for galaxies). */
const RIGHT = 0.002;
/** |Δv| > 1000 km/s: catastrophic (DESI convention, reference-values.md §6, M). */
const CATASTROPHIC = 0.0033;

const out: Record<string, unknown> = {};
const print = (s = '') => {
  if (!json) console.log(s);
};
const pct = (n: number, d: number) => (d > 0 ? `${((100 * n) / d).toFixed(1)}%` : '–');
const rms = (v: number[]) => (v.length > 0 ? Math.sqrt(v.reduce((s, x) => s + x * x, 0) / v.length) : NaN);
const medianAbs = (v: number[]) => {
  if (v.length === 0) return NaN;
  const a = v.map(Math.abs).sort((x, y) => x - y);
  return a[a.length >> 1]!;
};
const fixed = (x: number, d = 2) => (Number.isFinite(x) ? x.toFixed(d) : '–');
const started = Date.now();
const seconds = (t: number) => ((Date.now() - t) / 1000).toFixed(1);

// (i) Real spectra.
if (only.has('real')) {
  const t = Date.now();
  const rows = readManifest();
  if (!rows) {
    print('real spectra: ../shared/real-spectra is absent (it lives outside the repository); skipped\n');
    out.real = null;
  } else {
    const score = scoreRealSpectra(rows);
    print('(i) real spectra (../shared/real-spectra; halves by sha-256 of the file name, realSpectraSplit.ts)');
    print(formatHalf('tuning half', score.tuning));
    print(formatHalf('validation half', score.validation));
    print(formatHalf('both halves', score.all).split('\n')[0]);
    print(formatConfusion(score.tuning.confusion, `tuning half: true class × found class (${score.tuning.scanned} sources, reliable or not)`));
    print(formatConfusion(score.validation.confusion, `validation half: true class × found class (${score.validation.scanned} sources, reliable or not)`));
    print(`(${score.files.length} files in ${seconds(t)} s)\n`);
    const half = (h: HalfScore) => ({ reliable: h.reliable, top1: h.top1, top3: h.top3, misses: h.misses, confusion: h.confusion, scanned: h.scanned });
    out.real = { tuning: half(score.tuning), validation: half(score.validation), all: half(score.all), seconds: Number(seconds(t)) };
  }
}

// (ii) The engine's own synthetic generator (templates drawn from the engine's recipes).
if (only.has('generator')) {
  const t = Date.now();
  // Optical spectra (3600–9800 Å) except the Lyman-break sources: at z > 7 their break lies beyond
  // 9800 Å, so they are drawn on a red-optical + Y/J range (6500–13500 Å) that contains it; their S/N
  // is that of the continuum redward of Lyα (see generateSyntheticSpectrum). Stars: z = 0.
  const cases: Array<{ cls: TemplateClass; z: [number, number]; snr: number; range?: [number, number] }> = [
    { cls: 'galaxy', z: [0.05, 1.5], snr: 5 },
    { cls: 'galaxy', z: [0.05, 1.5], snr: 3 },
    { cls: 'galaxy', z: [0.05, 1.5], snr: 20 },
    { cls: 'quasar', z: [0.3, 4.5], snr: 5 },
    { cls: 'quasar', z: [0.3, 4.5], snr: 20 },
    { cls: 'lyman-break', z: [5, 8.5], snr: 3, range: [6500, 13500] },
    { cls: 'lyman-break', z: [5, 8.5], snr: 20, range: [6500, 13500] },
    { cls: 'lyman-break', z: [5, 7], snr: 3 },
    { cls: 'lyman-break', z: [5, 7], snr: 5 },
    { cls: 'lyman-break', z: [5, 7], snr: 20 },
    { cls: 'star', z: [0, 0], snr: 5 },
    { cls: 'star', z: [0, 0], snr: 20 },
  ];
  print(`(ii) engine generator (generateSyntheticSpectrum), ${perCase} per row; pulls (z − z_true)/zErr over the non-catastrophic`);
  print('class        z range      S/N   top≤0.002  top3≤0.002  |Δz|≤0.05  catastrophic  pull rms  med|pull|  range');
  const rowsOut: unknown[] = [];
  for (const c of cases) {
    let top = 0, top3 = 0, loose = 0, cat = 0;
    const pulls: number[] = [];
    for (let k = 0; k < perCase; k++) {
      const z = c.z[0] + ((c.z[1] - c.z[0]) * (k + 0.5)) / perCase;
      const r = scanSpectrum(generateSyntheticSpectrum({ class: c.cls, z, snr: c.snr, seed: 1000 + k, wavelengthMin: c.range?.[0], wavelengthMax: c.range?.[1] }));
      const dz = (s: { z: number }) => Math.abs(s.z - z) / (1 + z);
      const best = r.solutions[0];
      if (best && dz(best) <= RIGHT) top++;
      if (r.solutions.slice(0, 3).some((s) => dz(s) <= RIGHT)) top3++;
      if (best && Math.abs(best.z - z) <= 0.05) loose++;
      if (!best || dz(best) > CATASTROPHIC) cat++;
      else if (best.zErr > 0) pulls.push((best.z - z) / best.zErr);
    }
    const p = (n: number) => pct(n, perCase).padStart(9);
    print(`${c.cls.padEnd(12)} ${`${c.z[0]}–${c.z[1]}`.padEnd(11)} ${String(c.snr).padStart(4)}  ${p(top)}   ${p(top3)}  ${p(loose)}  ${p(cat)}    ${fixed(rms(pulls)).padStart(7)}  ${fixed(medianAbs(pulls)).padStart(8)}   ${(c.range ?? [3600, 9800]).join('–')} Å`);
    rowsOut.push({ class: c.cls, z: c.z, snr: c.snr, range: c.range ?? [3600, 9800], n: perCase, top1: top, top3, loose, catastrophic: cat, pullRms: rms(pulls), pullMedianAbs: medianAbs(pulls), pulls: pulls.length });
  }
  print(`(${cases.length * perCase} spectra in ${seconds(t)} s)\n`);
  out.generator = { perCase, rows: rowsOut, seconds: Number(seconds(t)) };
}

// (iii) The independent sky: written as files, read back and scanned as `npm run scan` does.
if (only.has('sky')) {
  const t = Date.now();
  const dir = keep ?? mkdtempSync(join(tmpdir(), 'redward-sky-'));
  /** lineSnr: emission-line galaxies only, the best strong line's S/N at the true z (lineVisibility.ts). */
  interface Outcome { truth: SkyTruth; found: SpectrumClass; top?: Solution; right: boolean; right3: boolean; catastrophic: boolean; readError?: string; lineSnr?: number }
  const outcomes: Outcome[] = [];
  let generateMs = 0;
  let last = Date.now();
  writeIndependentSky(dir, skyCount, seed, (s, path) => {
    generateMs += Date.now() - last;
    const truth = s.truth;
    let outcome: Outcome;
    try {
      const spectrum = readSpectrum(new Uint8Array(readFileSync(path)));
      const r = scanSpectrum(spectrum);
      const dz = (x: Solution) => Math.abs(x.z - truth.z) / (1 + truth.z);
      const top = r.solutions[0];
      outcome = { truth, found: r.class, top, right: !!top && dz(top) <= RIGHT, right3: r.solutions.slice(0, 3).some((x) => dz(x) <= RIGHT), catastrophic: !top || dz(top) > CATASTROPHIC };
      if (truth.kind === 'emission-line') outcome.lineSnr = bestLineSnr(prepareSpectrum(spectrum), truth.z);
    } catch (e) {
      outcome = { truth, found: 'unknown', right: false, right3: false, catastrophic: true, readError: (e as Error).message };
    }
    outcomes.push(outcome);
    last = Date.now();
  });
  if (!keep) rmSync(dir, { recursive: true, force: true });
  const band = (snr: number) => (snr < 5 ? '2–5' : snr < 10 ? '5–10' : '≥10');
  const bands = ['2–5', '5–10', '≥10'];
  print(`(iii) independent sky, ${skyCount} spectra, seed ${seed}${keep ? `, files kept in ${keep}` : ''}; right = top |Δz|/(1+z) ≤ ${RIGHT}, class = the scan's class`);
  print('class        S/N      n   top≤0.002  top3≤0.002  right class  catastrophic  pull rms  med|pull|  rms with zSysErr');
  const table: unknown[] = [];
  const summarise = (label: string, bandName: string, set: Outcome[], cls?: SpectrumClass) => {
    if (set.length === 0) return;
    const pulls = set.filter((o) => !o.catastrophic && o.top && o.top.zErr > 0).map((o) => (o.top!.z - o.truth.z) / o.top!.zErr);
    // The same pulls with the systematic term of Lyman-break galaxies and quasars in quadrature.
    const sysPulls = set.filter((o) => !o.catastrophic && o.top && o.top.zErr > 0).map((o) => (o.top!.z - o.truth.z) / Math.hypot(o.top!.zErr, o.top!.zSysErr ?? 0));
    const right = set.filter((o) => o.right).length;
    const right3 = set.filter((o) => o.right3).length;
    const cat = set.filter((o) => o.catastrophic).length;
    const classOk = set.filter((o) => o.found === (cls ?? o.truth.class)).length;
    print(`${label.padEnd(12)} ${bandName.padEnd(5)} ${String(set.length).padStart(4)}  ${pct(right, set.length).padStart(9)}   ${pct(right3, set.length).padStart(9)}   ${pct(classOk, set.length).padStart(9)}   ${pct(cat, set.length).padStart(9)}    ${fixed(rms(pulls)).padStart(7)}  ${fixed(medianAbs(pulls)).padStart(8)}  ${fixed(rms(sysPulls)).padStart(10)}`);
    table.push({ class: label, snr: bandName, n: set.length, top1: right, top3: right3, rightClass: classOk, catastrophic: cat, pullRms: rms(pulls), pullMedianAbs: medianAbs(pulls), pullRmsWithSystematic: rms(sysPulls), pulls: pulls.length });
  };
  for (const cls of ['galaxy', 'quasar', 'lyman-break', 'star'] as const) {
    const ofClass = outcomes.filter((o) => o.truth.class === cls);
    for (const b of bands) summarise(cls, b, ofClass.filter((o) => band(o.truth.snr) === b), cls);
    summarise(cls, 'all', ofClass, cls);
  }
  summarise('all', 'all', outcomes);
  print('\nby kind (all S/N)');
  const kinds = [...new Set(outcomes.map((o) => o.truth.kind))].sort();
  for (const k of kinds) summarise(k, 'all', outcomes.filter((o) => o.truth.kind === k));
  // Emission-line galaxies whose every strong line is below 5σ at the true z show nothing to claim.
  const lineless = outcomes.filter((o) => o.lineSnr !== undefined && o.lineSnr < LINE_DETECTION_SIGMA);
  const withFeatures = outcomes.filter((o) => !lineless.includes(o));
  print(
    `\nemission-line galaxies with no strong line ≥ ${LINE_DETECTION_SIGMA}σ at the true z: ${lineless.length} of ${outcomes.filter((o) => o.lineSnr !== undefined).length} (right z: ${lineless.filter((o) => o.right).length}; "unknown": ${lineless.filter((o) => o.found === 'unknown').length}); ` +
      `top≤${RIGHT} over the other ${withFeatures.length} spectra: ${pct(withFeatures.filter((o) => o.right).length, withFeatures.length)}`,
  );
  // The real-spectra manifest scores quasars and stars at 0.005 and quiescent galaxies at 0.003 in
  // (1 + z) (../shared/real-spectra/MANIFEST.tsv); Lyman-break sources are taken as the quasars.
  const manifestTolerance = (o: Outcome) => (o.truth.class === 'galaxy' ? (o.truth.kind === 'emission-line' ? RIGHT : 0.003) : 0.005);
  const rightAtManifest = outcomes.filter((o) => o.top && Math.abs(o.top.z - o.truth.z) / (1 + o.truth.z) <= manifestTolerance(o)).length;
  print(`top-1 at the real-spectra manifest's tolerance per class (galaxies 0.002, quiescent and post-starburst 0.003, quasars, Lyman-break and stars 0.005): ${pct(rightAtManifest, outcomes.length)}`);
  const confusion: ConfusionMatrix = emptyConfusion();
  for (const o of outcomes) countConfusion(confusion, o.truth.class, o.found);
  print('');
  print(formatConfusion(confusion, 'independent sky: true class × found class (all S/N)'));
  const bright = outcomes.filter((o) => o.truth.snr >= 10);
  const lbgAsGalaxy = bright.filter((o) => o.truth.class === 'lyman-break' && o.found === 'galaxy');
  const breakAsLbg = bright.filter((o) => (o.truth.kind === 'quiescent' || o.truth.kind === 'post-starburst') && o.found === 'lyman-break');
  const nLbg = bright.filter((o) => o.truth.class === 'lyman-break').length;
  const nBreak = bright.filter((o) => o.truth.kind === 'quiescent' || o.truth.kind === 'post-starburst').length;
  print(`\nS/N ≥ 10: Lyman-break read as galaxy ${lbgAsGalaxy.length}/${nLbg}; 4000 Å-break galaxies (quiescent, post-starburst) read as Lyman-break ${breakAsLbg.length}/${nBreak}`);
  for (const o of [...lbgAsGalaxy, ...breakAsLbg]) print(`  ${o.truth.file} ${o.truth.subclass} z ${o.truth.z.toFixed(4)} S/N ${o.truth.snr.toFixed(1)} → ${o.found} z ${o.top ? o.top.z.toFixed(4) : '–'} ${o.top?.template ?? ''}`);
  if (listMisses) {
    // Every sky spectrum whose top solution is wrong, with the draw's notes and where the truth ranks.
    print('\nmisses (file kind/subclass z S/N [notes] → top solution; rank of the right one)');
    for (const o of outcomes.filter((x) => !x.right)) {
      const t = o.truth;
      print(`  ${t.file} ${t.subclass} z ${t.z.toFixed(4)} S/N ${t.snr.toFixed(1)}${o.lineSnr !== undefined ? ` (best line ${o.lineSnr.toFixed(1)}σ)` : ''} ${t.lambdaMin.toFixed(0)}–${t.lambdaMax.toFixed(0)} Å [${t.notes}] → ${o.found} ${o.top ? `${o.top.template} z ${o.top.z.toFixed(4)} Δv ${((299_792.458 * (o.top.z - t.z)) / (1 + t.z)).toFixed(0)} km/s` : o.readError ?? 'none'}`);
    }
  }
  const readErrors = outcomes.filter((o) => o.readError);
  if (readErrors.length > 0) {
    print(`\nfiles the readers refused: ${readErrors.length}`);
    for (const o of readErrors) print(`  ${o.truth.file} (${o.truth.layout}, ${o.truth.medium}): ${o.readError}`);
  }
  print(`(${skyCount} spectra in ${seconds(t)} s, of which generating and writing ${(generateMs / 1000).toFixed(1)} s)\n`);
  out.sky = {
    count: skyCount, seed, table, confusion,
    snr10: { lymanBreakAsGalaxy: lbgAsGalaxy.length, lymanBreak: nLbg, breakGalaxyAsLymanBreak: breakAsLbg.length, breakGalaxies: nBreak },
    readErrors: readErrors.map((o) => ({ file: o.truth.file, message: o.readError })),
    withoutLineless: { lineless: lineless.length, spectra: withFeatures.length, top1: withFeatures.filter((o) => o.right).length },
    top1AtManifestTolerance: rightAtManifest,
    files: outcomes.map((o) => ({ ...o.truth, found: o.found, foundZ: o.top?.z ?? null, zErr: o.top?.zErr ?? null, template: o.top?.template ?? null, right: o.right, ...(o.lineSnr !== undefined ? { lineSnr: o.lineSnr } : {}) })),
    seconds: Number(seconds(t)), generateSeconds: generateMs / 1000,
  };
}

print(`total ${seconds(started)} s`);
if (json) console.log(JSON.stringify({ ...out, totalSeconds: Number(seconds(started)) }));

function usage(why: string): never {
  console.error(`Usage: npm run accuracy -- [--quick] [--json] [--only real,generator,sky] [--per-case N] [--sky N] [--seed S] [--keep DIR] [--misses]  (${why})`);
  process.exit(2);
}
