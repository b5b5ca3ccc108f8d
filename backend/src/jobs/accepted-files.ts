import { SPECTRUM_FILE_ENDINGS } from '../contracts/ingest';

export { SPECTRUM_FILE_ENDINGS };

export function isSpectrumFileName(name: string): boolean {
  const lower = name.toLowerCase();
  return SPECTRUM_FILE_ENDINGS.some((ending) => lower.endsWith(ending));
}

export function isZipFileName(name: string): boolean {
  return name.toLowerCase().endsWith('.zip');
}
