import { rankWithPhotoZ } from '../spectra/rankWithPhotoZ';
import { rankWithPz } from '../spectra/rankWithPz';
import type { Solution } from '../spectra/scanSpectrum';
import type { Scan } from '../contracts/spectra';

interface TypedPhotoZ {
  photoZ: number | null;
  photoZLow: number | null;
  photoZHigh: number | null;
}

/**
 * The photo-z prior applied on read, so a catalogue imported after the scan takes effect without
 * re-scanning and the stored ranking is never rewritten: typed photo-z first, else computed P(z).
 */
export function photoZPriorOf(solutions: readonly Solution[], target: TypedPhotoZ | null, pz: { z: number[]; p: number[] } | null): Scan['photoZPrior'] {
  if (solutions.length === 0 || !target) return undefined;
  // Each solution carries its scan rank through the re-ranking, so the order can be reported.
  const ranked0 = solutions.map((s, rank) => ({ ...s, rank }));
  let source: 'typed' | 'computed';
  let ranked: Array<(typeof ranked0)[number]>;
  if (target.photoZ !== null && target.photoZLow !== null && target.photoZHigh !== null) {
    source = 'typed';
    ranked = rankWithPhotoZ(ranked0, { z: target.photoZ, lo: target.photoZLow, hi: target.photoZHigh });
  } else if (pz && pz.p.some((v) => v > 0)) {
    source = 'computed';
    ranked = rankWithPz(ranked0, pz);
  } else return undefined;
  const order = ranked.map((s) => s.rank);
  const movedTop = order[0] !== 0;
  const label = source === 'typed' ? 'catalogue photo-z' : 'computed P(z)';
  const top = solutions[order[0]!]!;
  const message = movedTop
    ? `photo-z prior (${label}) moved z = ${zText(top.z)} (scan rank ${order[0]! + 1}) above z = ${zText(solutions[0]!.z)}`
    : `photo-z prior (${label}) kept the scan's best solution z = ${zText(solutions[0]!.z)}`;
  return { source, order, movedTop, message };
}

/** z to four decimals; a star's −0.00001 reads 0.0000, not −0.0000. */
function zText(z: number): string {
  const text = z.toFixed(4);
  return text === '-0.0000' ? '0.0000' : text;
}
