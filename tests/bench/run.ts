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
// Warm-up pass: builds the template set and compiles the hot loops, as in a running server.
for (const s of spectra) scanSpectrum(s);
// FFT and direct runs are interleaved (nine FFT scans, then one direct), so both see the same
// machine: on a shared host the speed drifts by tens of per cent within a minute. Wall-clock and
// this process's CPU time are both kept; the CPU figure is what "one core" costs when other work
// competes for the machine.
const wall = { fft: [] as number[], direct: [] as number[] };
const cpu = { fft: [] as number[], direct: [] as number[] };
const once = (method: 'fft' | 'direct', k: number) => {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  scanSpectrum(spectra[k % spectra.length]!, { zMin: 0, zMax: 9, method });
  wall[method].push(performance.now() - t0);
  const c = process.cpuUsage(c0);
  cpu[method].push((c.user + c.system) / 1000);
};
for (let k = 0; k < 45; k++) {
  once('fft', k);
  if (k % 9 === 8) once('direct', k);
}
const fft = median(wall.fft);
const direct = median(wall.direct);
const r = scanSpectrum(spectra[0]!);
console.log(`FFT scan ${fft.toFixed(1)} ms, direct ${direct.toFixed(0)} ms, ${r.meta.pixels} px, ${r.meta.templates.length} templates, ${spectra.length} spectra with different start pixels`);
console.log(`CPU time of this process: FFT ${median(cpu.fft).toFixed(1)} ms, direct ${median(cpu.direct).toFixed(0)} ms per spectrum`);
console.log(
  JSON.stringify({
    msPerSpectrum: +fft.toFixed(2),
    directMsPerSpectrum: +direct.toFixed(1),
    speedup: +(direct / fft).toFixed(1),
    cpuMsPerSpectrum: +median(cpu.fft).toFixed(2),
    directCpuMsPerSpectrum: +median(cpu.direct).toFixed(1),
    pixels: r.meta.pixels,
    templates: r.meta.templates.length,
  }),
);
