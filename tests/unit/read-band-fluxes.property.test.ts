import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { guessBandMapping, MAGNITUDE_SENTINEL, readBandFluxes } from '../../backend/src/ingest/read-band-fluxes';
import { abMagnitude, nJyFromAb } from '../../backend/src/photoz/photometry';

const BAND = { filter: 'jwst_f444w', flux: 'f', err: 'e' };

describe('readBandFluxes', () => {
  it('never throws: any pair of cells is a value, a skipped band or one sentence naming a column', () => {
    fc.assert(
      fc.property(fc.string(), fc.string(), fc.constantFrom('nJy', 'uJy', 'ABmag') as fc.Arbitrary<'nJy' | 'uJy' | 'ABmag'>, (f, e, unit) => {
        const problems: Array<[string, string]> = [];
        const out = readBandFluxes({ f, e }, [{ ...BAND, unit }], (column, message) => problems.push([column, message]));
        expect(out.length + problems.length).toBeLessThanOrEqual(1);
        for (const [column, message] of problems) {
          expect(['f', 'e']).toContain(column);
          expect(message).toMatch(/\(jwst_f444w\)|jwst_f444w/);
        }
        for (const b of out) {
          expect(Number.isFinite(b.fluxNjy)).toBe(true);
          expect(b.errNjy).toBeGreaterThan(0);
        }
      }),
      { numRuns: 500 },
    );
  });

  it('keeps negative and zero fluxes with their error, scales µJy by 1000', () => {
    const fail = () => {
      throw new Error('unexpected refusal');
    };
    expect(readBandFluxes({ f: '-3.5', e: '2' }, [{ ...BAND, unit: 'nJy' }], fail)[0]).toMatchObject({ fluxNjy: -3.5, errNjy: 2, givenValue: -3.5 });
    expect(readBandFluxes({ f: '0', e: '0.01' }, [{ ...BAND, unit: 'uJy' }], fail)[0]).toMatchObject({ fluxNjy: 0, errNjy: 10 });
    expect(readBandFluxes({ f: '', e: '' }, [{ ...BAND, unit: 'nJy' }], fail)).toEqual([]);
  });

  it('turns AB magnitudes into nJy and back, with σ_f = f σ_m ln10/2.5; a sentinel is a limit', () => {
    fc.assert(
      fc.property(fc.double({ min: 15, max: 35, noNaN: true }), fc.double({ min: 0.001, max: 1, noNaN: true }), (m, dm) => {
        const [b] = readBandFluxes({ f: m.toPrecision(10), e: dm.toPrecision(10) }, [{ ...BAND, unit: 'ABmag' }], () => {
          throw new Error('refused');
        });
        expect(abMagnitude(b!.fluxNjy)).toBeCloseTo(m, 6);
        expect(b!.errNjy / b!.fluxNjy).toBeCloseTo((dm * Math.LN10) / 2.5, 6);
      }),
      { numRuns: 200 },
    );
    // AB 31.4 is 1 nJy (3631 Jy × 10^(−0.4·31.4) ≈ 0.99 nJy; Oke & Gunn 1983 zero point).
    const [limit] = readBandFluxes({ f: String(99), e: '31.4' }, [{ ...BAND, unit: 'ABmag' }], () => {
      throw new Error('refused');
    });
    expect(limit).toMatchObject({ fluxNjy: 0, givenValue: 99 });
    expect(limit!.errNjy).toBeCloseTo(nJyFromAb(31.4), 10);
    expect(MAGNITUDE_SENTINEL).toBe(90);
  });
});

describe('guessBandMapping', () => {
  it('pairs flux/err, µJy and magnitude columns of known filters, case and punctuation ignored', () => {
    const columns = ['ID', 'FLUX_JWST_F444W', 'ERR_JWST_F444W', 'flux_ujy_acs_wfc_f606w', 'err_ujy_acs_wfc_f606w', 'mag_wfc3_ir_f160w', 'magerr_wfc3_ir_f160w', 'flux_nosuch', 'err_nosuch', 'flux_jwst_f200w'];
    expect(guessBandMapping(columns, ['jwst_f444w', 'acs_wfc_f606w', 'wfc3_ir_f160w', 'jwst_f200w'])).toEqual([
      { filter: 'jwst_f444w', flux: 'FLUX_JWST_F444W', err: 'ERR_JWST_F444W', unit: 'nJy' },
      { filter: 'acs_wfc_f606w', flux: 'flux_ujy_acs_wfc_f606w', err: 'err_ujy_acs_wfc_f606w', unit: 'uJy' },
      { filter: 'wfc3_ir_f160w', flux: 'mag_wfc3_ir_f160w', err: 'magerr_wfc3_ir_f160w', unit: 'ABmag' },
    ]);
  });
});
