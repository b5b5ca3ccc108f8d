import { readFileSync } from 'node:fs';
import { SpectrumReadError } from '../spectra/errors';
import { readSpectrum } from '../spectra/readSpectrum';
import { assertFiniteScan, NonFiniteScanError } from '../spectra/scanResultCheck';
import { scanSpectrum } from '../spectra/scanSpectrum';

// `npm run scan -- <files...> [--zmin A --zmax B] [--step S|native] [--json]`: one JSON object per file per line.
const args = process.argv.slice(2);
const files: string[] = [];
let zMin = 0;
let zMax = 9;
let step: number | 'native' | undefined;
for (let i = 0; i < args.length; i++) {
  const a = args[i]!;
  if (a === '--zmin' || a === '--zmax') {
    const v = Number(args[++i]);
    if (!Number.isFinite(v)) usage(`${a} needs a number`);
    if (a === '--zmin') zMin = v;
    else zMax = v;
  } else if (a === '--step') {
    const v = args[++i];
    step = v === 'native' ? 'native' : Number(v);
    if (step !== 'native' && !(step > 0 && step <= 0.01)) usage('--step needs a grid step in dex (0 < step ≤ 0.01) or "native"');
  } else if (a === '--json') continue;
  else if (a.startsWith('--')) usage(`unknown option ${a}`);
  else files.push(a);
}
if (files.length === 0) usage('no files given');

for (const file of files) {
  try {
    const spectrum = readSpectrum(new Uint8Array(readFileSync(file)));
    const r = assertFiniteScan(scanSpectrum(spectrum, { zMin, zMax, step }));
    const m = spectrum.meta;
    console.log(JSON.stringify({
      file, ok: true, class: r.class,
      ...(r.unknownReason ? { unknownReason: r.unknownReason } : {}),
      solutions: r.solutions.map((s) => ({ z: s.z, zErr: s.zErr, class: s.class, template: s.template, chi2: s.chi2, deltaChi2: s.deltaChi2, lines: s.lines.map((l) => ({ name: l.name, rest: l.rest, observed: l.observed })), ...(s.interlopers ? { interlopers: s.interlopers } : {}) })),
      meta: {
        pixels: r.meta.pixels, step: r.meta.step, wavelengthMin: r.meta.wavelengthMin, wavelengthMax: r.meta.wavelengthMax, medium: r.meta.medium, snrMedian: r.meta.snrMedian,
        ignoredPixels: m.ignoredPixels ?? 0, errorsEstimated: m.errorsEstimated, warnings: m.warnings,
      },
    }));
  } catch (e) {
    const code = e instanceof SpectrumReadError || e instanceof NonFiniteScanError ? e.code : e instanceof RangeError ? 'bad-range' : (e as NodeJS.ErrnoException).code ?? 'internal';
    console.log(JSON.stringify({ file, ok: false, error: { code, message: (e as Error).message } }));
  }
}

function usage(why: string): never {
  console.error(`Usage: npm run scan -- <files...> [--zmin A --zmax B] [--step S|native] [--json]  (${why})`);
  process.exit(2);
}
