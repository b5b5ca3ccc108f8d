import { describe, expect, it } from 'vitest';
import { asciiUnit, formatLinesMeasured, LYA_CAVEAT, lyaCaveat, restsOnLyaAlone } from '../../../backend/src/exports/lineEvidence';
import type { ExportLine } from '../../../backend/src/exports/types';

const line = (name: string, detected: boolean, extra: Partial<ExportLine> = {}): ExportLine => ({
  name, measure: 'flux', value: 1e-17, error: 2e-18, snr: detected ? 5 : 1, offsetKms: detected ? 120 : null, detected, blendedWith: [], ...extra,
});

describe('the Lyα caveat', () => {
  it('applies to Lyman-break sources and to values whose only detected line is Lyα', () => {
    expect(restsOnLyaAlone('lyman-break', ['C II 1335'], [])).toBe(true);
    expect(restsOnLyaAlone('galaxy', ['Ly-alpha', 'N V 1239'], [line('Ly-alpha', true), line('N V 1239', false)])).toBe(true);
    expect(restsOnLyaAlone('galaxy', ['Ly-alpha', 'C IV 1548'], [line('Ly-alpha', true), line('C IV 1548', true)])).toBe(false);
    // Records confirmed before lines were measured: decided by the names alone.
    expect(restsOnLyaAlone('galaxy', ['Ly-alpha'], [])).toBe(true);
    expect(restsOnLyaAlone('quasar', ['Ly-alpha', 'C IV 1548'], [])).toBe(false);
    expect(lyaCaveat('lyman-break', [], [])).toBe(LYA_CAVEAT);
    expect(LYA_CAVEAT).toMatch(/Shapley et al\. 2003, from memory/);
  });
});

describe('formatLinesMeasured', () => {
  it('writes each line once, blends joined by +, EWs and ratios by their own names', () => {
    const text = formatLinesMeasured([
      line('[O II] 3727', true, { blendedWith: ['[O II] 3730'], value: 4.567e-17, error: 5.04e-18, snr: 9.06, offsetKms: -20.6 }),
      line('[O II] 3730', true, { blendedWith: ['[O II] 3727'], value: 4.567e-17, error: 5.04e-18, snr: 9.06, offsetKms: -20.6 }),
      line('Ca II K', true, { measure: 'ew', value: -2.5, error: 0.41, snr: 6.1, offsetKms: null }),
      line('4000 Å break', true, { measure: 'break', value: null, error: null, snr: 12.2, offsetKms: null }),
      line('H-beta', false, { value: 3e-18, error: 2.9e-18, snr: 1.03 }),
    ]);
    expect(text).toBe(
      '[O II] 3727+[O II] 3730:flux=4.57e-17+/-5.04e-18:sn=9.1:dv=-21;Ca II K:ew=-2.5+/-0.41:sn=6.1;4000 Å break:sn=12.2;H-beta:flux=3e-18+/-2.9e-18:sn=1.0:below-3sigma',
    );
    expect(formatLinesMeasured([])).toBeNull();
  });

  it('writes units in ASCII', () => {
    expect(asciiUnit('erg s⁻¹ cm⁻²')).toBe('erg s-1 cm-2');
    expect(asciiUnit('arbitrary × Å')).toBe('arbitrary x Angstrom');
  });
});
