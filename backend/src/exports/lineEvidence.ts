import { LYA_CAVEAT } from '../contracts/line-measurements';
import type { ExportLine, SpectrumClass } from './types';

// The same words as in the reading form.
export { LYA_CAVEAT };

/**
 * Whether a value rests on Lyα alone: a Lyman-break source (its break sits at Lyα), or Lyα the
 * only detected line among those used (the only line named, for records without measurements).
 */
export function restsOnLyaAlone(cls: SpectrumClass, lines: readonly string[], measured: readonly ExportLine[]): boolean {
  if (cls === 'lyman-break') return true;
  if (measured.length === 0) return lines.length === 1 && lines[0] === 'Ly-alpha';
  const detected = measured.filter((m) => m.detected).map((m) => m.name);
  return detected.length === 1 && detected[0] === 'Ly-alpha';
}

export function lyaCaveat(cls: SpectrumClass, lines: readonly string[], measured: readonly ExportLine[]): string | null {
  return restsOnLyaAlone(cls, lines, measured) ? LYA_CAVEAT : null;
}

/** Three significant digits, written the shortest way ("7.93e-17", "12.3"). */
const sig3 = (v: number) => String(Number(v.toPrecision(3)));

/** Unit text in ASCII so every format (FITS columns hold ASCII only) keeps it whole: "erg s⁻¹ cm⁻²" → "erg s-1 cm-2". */
export function asciiUnit(unit: string): string {
  const map: Record<string, string> = { '⁻': '-', '¹': '1', '²': '2', '³': '3', '×': 'x', 'Å': 'Angstrom', 'µ': 'u', 'μ': 'u' };
  return [...unit].map((ch) => map[ch] ?? ch).join('');
}

/**
 * The lines of a record with their measurements in one compact field, e.g.
 * "H-alpha:flux=7.93e-17+/-1.07e-17:sn=7.4:dv=50;[O II] 3727+[O II] 3730:flux=2.7e-17+/-8.7e-18:sn=3.1:dv=217".
 * Blended lines are written once, joined by '+'; EWs as "ew=" (rest Å, negative for absorption),
 * breaks as "ratio=" (f_ν red/blue, absent when the blue side is not measured); a line used that
 * is below 3σ ends in ":below-3sigma". Null when there is nothing measured.
 */
export function formatLinesMeasured(lines: readonly ExportLine[]): string | null {
  const written = new Set<string>();
  const parts: string[] = [];
  for (const m of lines) {
    if (written.has(m.name)) continue;
    const group = [m.name, ...m.blendedWith.filter((b) => lines.some((l) => l.name === b))];
    for (const g of group) written.add(g);
    const fields = [group.join('+')];
    const key = m.measure === 'flux' ? 'flux' : m.measure === 'ew' ? 'ew' : 'ratio';
    if (m.value !== null) fields.push(`${key}=${sig3(m.value)}${m.error !== null ? `+/-${sig3(m.error)}` : ''}`);
    if (m.snr !== null) fields.push(`sn=${m.snr.toFixed(1)}`);
    if (m.offsetKms !== null) fields.push(`dv=${Math.round(m.offsetKms)}`);
    if (!m.detected) fields.push('below-3sigma');
    parts.push(fields.join(':'));
  }
  return parts.length ? parts.join(';') : null;
}
