import { generateSyntheticSpectrum } from '../../backend/src/spectra/generateSyntheticSpectrum';
import { scanSpectrum } from '../../backend/src/spectra/scanSpectrum';

// `npm run bench -- --json`: a 4,000-pixel spectrum scanned over 0 ≤ z ≤ 9 with every template, by
// FFT correlations and by the direct loop over shifts; medians in ms. Last line is JSON.
const spectrum = generateSyntheticSpectrum({ class: 'galaxy', z: 1.1, snr: 8, seed: 2024, pixels: 4000 });
const median = (v: number[]) => v.slice().sort((a, b) => a - b)[v.length >> 1]!;
const time = (method: 'fft' | 'direct', runs: number) => {
  const t: number[] = [];
  for (let k = 0; k < runs; k++) {
    const t0 = performance.now();
    scanSpectrum(spectrum, { zMin: 0, zMax: 9, method });
    t.push(performance.now() - t0);
  }
  return median(t);
};
scanSpectrum(spectrum); // builds templates and fills the FFT cache, as in a campaign of one instrument
const fft = time('fft', 15);
const direct = time('direct', 3);
const r = scanSpectrum(spectrum);
console.log(`FFT scan ${fft.toFixed(1)} ms, direct ${direct.toFixed(0)} ms, ${r.meta.pixels} px, ${r.meta.templates.length} templates`);
console.log(JSON.stringify({ msPerSpectrum: +fft.toFixed(2), directMsPerSpectrum: +direct.toFixed(1), speedup: +(direct / fft).toFixed(1), pixels: r.meta.pixels, templates: r.meta.templates.length }));
