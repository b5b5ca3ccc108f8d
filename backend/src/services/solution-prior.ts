import { rankWithPhotoZ } from '../spectra/rankWithPhotoZ';
import { rankWithPz } from '../spectra/rankWithPz';
import type { Solution } from '../spectra/scanSpectrum';
import type { Scan } from '../contracts/spectra';

interface TypedPhotoZ {
  photoZ: number | null;
  photoZLow: number | null;
  photoZHigh: number | null;
}

export type PhotoZPriorSource = 'typed' | 'computed' | 'none';

/** How exports and the inspection screen name each prior ("photo-z prior: typed | computed P(z) | none"). */
export const PHOTOZ_PRIOR_LABELS: Record<PhotoZPriorSource, string> = { typed: 'typed', computed: 'computed P(z)', none: 'none' };

/** The convention in one sentence, for export assumptions; photoZPriorOf below is what applies it. */
export const PHOTOZ_PRIOR_NOTE =
  "photo-z prior: typed | computed P(z) | none. Where a spectrum's target has one, the engine's solutions are ranked on read (the inspection screen readers use) with the target's typed catalogue photo-z and its 68 % range (photo_z, photo_z_low, photo_z_high) when all three are given, else with the P(z) Redward computed from the catalogue fluxes (z_phot columns), else with none; the stored scan ranking is never rewritten, and z in this file is the readers' confirmed value, which no prior changes";

/** Which prior ranks a target's spectra: typed photo-z first, else a computed P(z) with mass, else none. */
export function photoZPriorSource(target: TypedPhotoZ | null, pz: { z: number[]; p: number[] } | null): PhotoZPriorSource {
  if (!target) return 'none';
  if (target.photoZ !== null && target.photoZLow !== null && target.photoZHigh !== null) return 'typed';
  if (pz && pz.p.some((v) => v > 0)) return 'computed';
  return 'none';
}

/**
 * The photo-z prior applied on read, so a catalogue imported after the scan takes effect without
 * re-scanning and the stored ranking is never rewritten: typed photo-z first, else computed P(z).
 */
export function photoZPriorOf(solutions: readonly Solution[], target: TypedPhotoZ | null, pz: { z: number[]; p: number[] } | null): Scan['photoZPrior'] {
  if (solutions.length === 0 || !target) return undefined;
  // Each solution carries its scan rank through the re-ranking, so the order can be reported.
  const ranked0 = solutions.map((s, rank) => ({ ...s, rank }));
  const source = photoZPriorSource(target, pz);
  let ranked: Array<(typeof ranked0)[number]>;
  if (source === 'typed') ranked = rankWithPhotoZ(ranked0, { z: target.photoZ!, lo: target.photoZLow!, hi: target.photoZHigh! });
  else if (source === 'computed') ranked = rankWithPz(ranked0, pz!);
  else return undefined;
  const order = ranked.map((s) => s.rank);
  const movedTop = order[0] !== 0;
  const label = source === 'typed' ? 'catalogue photo-z' : PHOTOZ_PRIOR_LABELS.computed;
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
