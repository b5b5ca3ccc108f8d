import { generateSyntheticSpectrum } from '../spectra/generateSyntheticSpectrum';
import { scanSpectrum } from '../spectra/scanSpectrum';
import type { TemplateClass } from '../spectra/types';

// `npm run accuracy`: synthetic recovery per class, z range and S/N (seeded, reproducible).
// Optical spectra (3600–9800 Å) except the Lyman-break sources: at z > 7 their break lies beyond
// 9800 Å, so they are drawn on a red-optical + Y/J range (6500–13500 Å) that contains it; their S/N
// is that of the continuum redward of Lyα (see generateSyntheticSpectrum).
const cases: Array<{ cls: TemplateClass; z: [number, number]; snr: number; range?: [number, number] }> = [
  { cls: 'galaxy', z: [0.05, 1.5], snr: 5 },
  { cls: 'galaxy', z: [0.05, 1.5], snr: 3 },
  { cls: 'quasar', z: [0.3, 4.5], snr: 5 },
  { cls: 'lyman-break', z: [5, 8.5], snr: 3, range: [6500, 13500] },
  { cls: 'lyman-break', z: [5, 7], snr: 3 },
];
const only = process.argv[3];
const perCase = Number(process.argv[2] ?? 40);
console.log('class        z range      S/N   top≤0.002  top3≤0.002  |Δz|≤0.05  catastrophic  range');
for (const c of cases) {
  if (only && c.cls !== only) continue;
  let top = 0, top3 = 0, loose = 0, cat = 0;
  for (let k = 0; k < perCase; k++) {
    const z = c.z[0] + ((c.z[1] - c.z[0]) * (k + 0.5)) / perCase;
    const r = scanSpectrum(generateSyntheticSpectrum({ class: c.cls, z, snr: c.snr, seed: 1000 + k, wavelengthMin: c.range?.[0], wavelengthMax: c.range?.[1] }));
    const dz = (s: { z: number }) => Math.abs(s.z - z) / (1 + z);
    const best = r.solutions[0];
    if (best && dz(best) <= 0.002) top++;
    if (r.solutions.slice(0, 3).some((s) => dz(s) <= 0.002)) top3++;
    if (best && Math.abs(best.z - z) <= 0.05) loose++;
    if (!best || dz(best) > 0.0033) cat++; // |Δv| > 1000 km/s (DESI convention, reference-values.md §6, M)
  }
  const pct = (n: number) => `${((100 * n) / perCase).toFixed(1)}%`.padStart(9);
  console.log(`${c.cls.padEnd(12)} ${`${c.z[0]}–${c.z[1]}`.padEnd(11)} ${String(c.snr).padStart(4)}  ${pct(top)}   ${pct(top3)}  ${pct(loose)}  ${pct(cat)}   ${(c.range ?? [3600, 9800]).join('–')} Å`);
}
