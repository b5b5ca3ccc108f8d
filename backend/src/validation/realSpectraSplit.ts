import { createHash } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { readSpectrum } from '../spectra/readSpectrum';
import { scanSpectrum, type Solution } from '../spectra/scanSpectrum';
import type { SpectrumClass } from '../spectra/types';
import { countConfusion, emptyConfusion, type ConfusionMatrix } from './confusionMatrix';

/**
 * The real spectra with published redshifts (../shared/real-spectra, outside the repository; its
 * README.md and MANIFEST.tsv name each file's source). Resolved from the project root, which is
 * three folders above this module.
 */
export const REAL_SPECTRA_DIR = join(dirname(fileURLToPath(import.meta.url)), '..', '..', '..', '..', 'shared', 'real-spectra');

/** Which half of the real set a file belongs to: engine choices are tuned on one, checked on the other. */
export type SplitHalf = 'tuning' | 'validation';

/** One MANIFEST.tsv row (columns file … tolerance; `reference_z` "none" or empty → NaN). */
export interface ManifestRow {
  file: string;
  sourceRepo: string;
  sourcePath: string;
  commit: string;
  objectClass: string;
  referenceZ: number;
  zSource: string;
  notes: string;
  reliable: boolean;
  /** As written, e.g. "0.002rel" (|Δz|/(1 + z)) or "0.05abs" (|Δz|). */
  tolerance: string;
}

/**
 * Parses MANIFEST.tsv text (tab-separated, one header line). Throws a RangeError naming the line
 * when a row has fewer than ten columns or a tolerance that is neither "<x>rel" nor "<x>abs".
 */
export function parseManifest(text: string): ManifestRow[] {
  const lines = text.split(/\r?\n/);
  const rows: ManifestRow[] = [];
  for (let i = 1; i < lines.length; i++) {
    const line = lines[i]!;
    if (line.trim() === '') continue;
    const c = line.split('\t');
    if (c.length < 10) throw new RangeError(`MANIFEST.tsv line ${i + 1}: ${c.length} columns, expected 10 (file … tolerance).`);
    if (!/^[0-9.]+(rel|abs)$/.test(c[9]!.trim())) throw new RangeError(`MANIFEST.tsv line ${i + 1}: tolerance "${c[9]}" is neither <x>rel nor <x>abs.`);
    const z = c[5]!.trim();
    rows.push({
      file: c[0]!, sourceRepo: c[1]!, sourcePath: c[2]!, commit: c[3]!, objectClass: c[4]!,
      referenceZ: z === '' || z === 'none' ? NaN : Number(z), zSource: c[6]!, notes: c[7]!,
      reliable: c[8]!.trim() === 'yes', tolerance: c[9]!.trim(),
    });
  }
  return rows;
}

/** Reads MANIFEST.tsv from `dir`; undefined when the folder is absent (it lives outside the repository). */
export function readManifest(dir = REAL_SPECTRA_DIR): ManifestRow[] | undefined {
  const path = join(dir, 'MANIFEST.tsv');
  return existsSync(path) ? parseManifest(readFileSync(path, 'utf8')) : undefined;
}

/**
 * The half a file belongs to: sha-256 of its path exactly as MANIFEST.tsv lists it (UTF-8), first
 * byte even → 'tuning', odd → 'validation'. Depends on the name only, so adding or removing other
 * files never moves a file between halves.
 *
 * @example splitHalf('sdss/spec-0266-51602-0001.fits') // 'tuning'
 */
export function splitHalf(file: string): SplitHalf {
  const first = createHash('sha256').update(file, 'utf8').digest()[0]!;
  return first % 2 === 0 ? 'tuning' : 'validation';
}

/**
 * The engine class family of a MANIFEST object_class: GALAXY* → galaxy, QSO* → quasar, STAR* →
 * star, LBG* → lyman-break (rest-frame composites and templates count as their family);
 * undefined for rows that are not an astronomical source (SKY, DOC, ERROR_SPECTRUM).
 */
export function classFamily(objectClass: string): SpectrumClass | undefined {
  if (/^GALAXY/.test(objectClass)) return 'galaxy';
  if (/^QSO/.test(objectClass)) return 'quasar';
  if (/^STAR/.test(objectClass)) return 'star';
  if (/^LBG/.test(objectClass)) return 'lyman-break';
  return undefined;
}

/** Whether redshift `z` lies within a row's tolerance of its reference redshift. */
export function withinTolerance(row: Pick<ManifestRow, 'referenceZ' | 'tolerance'>, z: number): boolean {
  const tol = parseFloat(row.tolerance);
  const dz = Math.abs(z - row.referenceZ);
  return row.tolerance.endsWith('rel') ? dz / (1 + row.referenceZ) <= tol : dz <= tol;
}

/** One scanned file: its row, half, family and the engine's ranked solutions. */
export interface ScoredFile {
  row: ManifestRow;
  half: SplitHalf;
  family: SpectrumClass;
  /** The scan's class ('unknown' when nothing beats a zero model clearly). */
  found: SpectrumClass;
  solutions: Solution[];
  /** Reliable rows only: top solution / one of the top three within the tolerance. */
  top1?: boolean;
  top3?: boolean;
}

/** A reliable row whose top solution misses its tolerance. */
export interface RealMiss {
  file: string;
  trueZ: number;
  trueClass: SpectrumClass;
  foundZ: number | null;
  foundClass: SpectrumClass;
  template: string | null;
}

/** Scores of one half (or of the whole set). */
export interface HalfScore {
  /** Reliable rows scanned, and how many had the right z first / among the top three. */
  reliable: number;
  top1: number;
  top3: number;
  misses: RealMiss[];
  /** Every scanned row with a class family (reliable or not): true family × found class. */
  confusion: ConfusionMatrix;
  /** Scanned rows counted in the confusion matrix. */
  scanned: number;
}

export interface RealSpectraScore {
  tuning: HalfScore;
  validation: HalfScore;
  all: HalfScore;
  files: ScoredFile[];
}

/**
 * Scans every source in MANIFEST.tsv (readSpectrum + scanSpectrum with default settings, exactly
 * as `npm run scan` does) and scores each half: reliable rows within their tolerance as the top
 * solution and among the top three, the misses, and a class confusion matrix over all rows with a
 * class family. Rows that are no source (SKY, DOC, ERROR_SPECTRUM) are not scanned.
 *
 * @param onFile called after each scan (progress, per-file tables)
 */
export function scoreRealSpectra(rows: ManifestRow[], dir = REAL_SPECTRA_DIR, onFile?: (f: ScoredFile) => void): RealSpectraScore {
  const files: ScoredFile[] = [];
  for (const row of rows) {
    const family = classFamily(row.objectClass);
    if (!family) continue;
    const result = scanSpectrum(readSpectrum(new Uint8Array(readFileSync(join(dir, row.file)))));
    const scored: ScoredFile = { row, half: splitHalf(row.file), family, found: result.class, solutions: result.solutions };
    if (row.reliable && Number.isFinite(row.referenceZ)) {
      scored.top1 = result.solutions[0] !== undefined && withinTolerance(row, result.solutions[0].z);
      scored.top3 = result.solutions.slice(0, 3).some((s) => withinTolerance(row, s.z));
    }
    files.push(scored);
    onFile?.(scored);
  }
  return {
    tuning: scoreHalf(files.filter((f) => f.half === 'tuning')),
    validation: scoreHalf(files.filter((f) => f.half === 'validation')),
    all: scoreHalf(files),
    files,
  };
}

function scoreHalf(files: ScoredFile[]): HalfScore {
  const score: HalfScore = { reliable: 0, top1: 0, top3: 0, misses: [], confusion: emptyConfusion(), scanned: files.length };
  for (const f of files) {
    countConfusion(score.confusion, f.family, f.found);
    if (f.top1 === undefined) continue;
    score.reliable++;
    if (f.top1) score.top1++;
    if (f.top3) score.top3++;
    if (!f.top1) {
      const top = f.solutions[0];
      score.misses.push({ file: f.row.file, trueZ: f.row.referenceZ, trueClass: f.family, foundZ: top?.z ?? null, foundClass: f.found, template: top?.template ?? null });
    }
  }
  return score;
}

/** A short text summary of one half: top-1 and top-3 fractions, then one line per miss. */
export function formatHalf(name: string, s: HalfScore): string {
  const pct = (n: number) => (s.reliable > 0 ? `${((100 * n) / s.reliable).toFixed(1)} %` : '–');
  const head = `${name}: reliable top-1 ${s.top1}/${s.reliable} = ${pct(s.top1)}, top-3 ${s.top3}/${s.reliable} = ${pct(s.top3)}`;
  const misses = s.misses.map((m) =>
    `  miss ${m.file.padEnd(46)} true z ${m.trueZ.toFixed(4).padStart(8)} ${m.trueClass.padEnd(11)} found ${m.foundZ === null ? '    none' : m.foundZ.toFixed(4).padStart(8)} ${m.foundClass.padEnd(11)} ${m.template ?? ''}`);
  return [head, ...misses].join('\n');
}
