import type { Spectrum } from '../spectra/types';

/**
 * A spectrum as a CSV table (wavelength in Å, flux, 1σ error, mask), the plainest layout the
 * readers accept; used for the demo campaign's files and for tests of the upload path.
 */
export function spectrumToCsv(spectrum: Spectrum, comment?: string): string {
  const lines: string[] = [];
  if (comment) lines.push(...comment.split('\n').map((l) => `# ${l}`));
  lines.push(`# medium: ${spectrum.meta.medium}`);
  lines.push('wavelength_angstrom,flux,error,mask');
  const { wavelength, flux, ivar, mask } = spectrum;
  for (let i = 0; i < wavelength.length; i++) {
    const err = ivar[i]! > 0 ? 1 / Math.sqrt(ivar[i]!) : 0;
    lines.push(`${wavelength[i]!.toFixed(3)},${flux[i]!.toPrecision(6)},${err.toPrecision(5)},${mask[i]}`);
  }
  return lines.join('\n') + '\n';
}
