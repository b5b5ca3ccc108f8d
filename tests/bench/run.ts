import { generateSyntheticSpectrum } from '../../backend/src/spectra/generateSyntheticSpectrum';
import { scanSpectrum } from '../../backend/src/spectra/scanSpectrum';

// `npm run bench -- --json`: 4,000-pixel spectra scanned over 0 ≤ z ≤ 9 with every template, by
// FFT correlations and by the direct loop over shifts; medians in ms. Last line is JSON.
// The spectra start at slightly different wavelengths (as fibres or slits of one instrument do), so
// the figure includes any work that depends on where a spectrum sits on the global grid.
const spectra = Array.from({ length: 15 }, (_, k) =>
  generateSyntheticSpectrum({ class: 'galaxy', z: 0.4 + 0.07 * k, snr: 8, seed: 2024 + k, pixels: 4000, wavelengthMin: 3600 + 3.7 * k, wavelengthMax: 9800 + 3.7 * k }),
);
const median = (v: number[]) => v.slice().sort((a, b) => a - b)[v.length >> 1]!;
const time = (method: 'fft' | 'direct', runs: number) => {
  const t: number[] = [];
  for (let k = 0; k < runs; k++) {
    const t0 = performance.now();
    scanSpectrum(spectra[k % spectra.length]!, { zMin: 0, zMax: 9, method });
    t.push(performance.now() - t0);
  }
  return median(t);
};
// Warm-up pass: builds the template set and compiles the hot loops, as in a running server.
for (const s of spectra) scanSpectrum(s);
const fft = time('fft', 2 * spectra.length);
const direct = time('direct', 3);
const r = scanSpectrum(spectra[0]!);
console.log(`FFT scan ${fft.toFixed(1)} ms, direct ${direct.toFixed(0)} ms, ${r.meta.pixels} px, ${r.meta.templates.length} templates, ${spectra.length} spectra with different start pixels`);
console.log(JSON.stringify({ msPerSpectrum: +fft.toFixed(2), directMsPerSpectrum: +direct.toFixed(1), speedup: +(direct / fft).toFixed(1), pixels: r.meta.pixels, templates: r.meta.templates.length }));
