import type { LineMeasurementView } from '@contracts/line-measurements';

/** Three significant digits, exponent form for small fluxes. */
const sig = (v: number) => (v !== 0 && (Math.abs(v) < 0.01 || Math.abs(v) >= 1e5) ? v.toExponential(2) : String(Number(v.toPrecision(3))));

/** The measured quantity of a line as "value ± error unit", or why it has none. */
export function measurementText(m: LineMeasurementView, fluxUnit: string): string {
  if (!m.measured) return m.note ?? 'not measured';
  if (m.measure === 'flux' && m.flux !== null && m.fluxErr !== null) return `${sig(m.flux)} ± ${sig(m.fluxErr)} ${fluxUnit}`;
  if (m.measure === 'ew' && m.ewRest !== null && m.ewRestErr !== null) return `EW ${sig(m.ewRest)} ± ${sig(m.ewRestErr)} Å`;
  if (m.breakRatio !== null && m.breakRatioErr !== null) return `ratio ${sig(m.breakRatio)} ± ${sig(m.breakRatioErr)}`;
  return m.measure === 'break' ? 'break: no flux measured blueward' : 'no continuum for an EW';
}
