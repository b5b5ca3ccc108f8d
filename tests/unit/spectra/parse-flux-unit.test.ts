import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { FLUX_LAMBDA, FLUX_NU, fluxUnitFromText, parseFluxUnit } from '../../../backend/src/spectra/parseFluxUnit';

const close = (a: number | undefined, b: number) => expect(Math.abs((a ?? NaN) / b - 1)).toBeLessThan(1e-9);

describe('parseFluxUnit: f_λ spellings, normalised to erg s⁻¹ cm⁻² Å⁻¹', () => {
  // Conversions: 1 W = 1e7 erg s⁻¹, 1 m² = 1e4 cm², 1 nm = 10 Å, 1 µm = 1e4 Å (SI definitions).
  const cases: Array<[string, number]> = [
    ['erg/s/cm2/A', 1],
    ['erg/s/cm²/Å', 1],
    ['erg/cm2/s/A', 1],
    ['ergs/s/cm^2/A', 1],
    ['erg s-1 cm-2 A-1', 1],
    ['erg s^-1 cm^-2 Angstrom^-1', 1],
    ['erg.s-1.cm-2.Angstrom-1', 1],
    ['erg/(s cm2 AA)', 1],
    ['erg s⁻¹ cm⁻² Å⁻¹', 1],
    ['flam', 1],
    ['FLAM', 1],
    ['1e-17 erg/s/cm^2/Angstrom', 1e-17],
    ['1E-17 erg/cm^2/s/Ang', 1e-17],
    ['10^-17 erg/s/cm2/A', 1e-17],
    ['10**(-17) erg/s/cm2/A', 1e-17],
    ['x10^-17 erg s-1 cm-2 A-1', 1e-17],
    ['×10⁻¹⁷ erg/s/cm²/Å', 1e-17],
    ['(1e-17 erg/s/cm2/A)', 1e-17],
    ['1e-16erg/s/cm2/A', 1e-16],
    ['2.5e-18 erg/s/cm2/A', 2.5e-18],
    ['erg s**(-1) cm**(-2) nm**(-1)', 0.1],
    ['erg/s/cm2/um', 1e-4],
    ['erg/s/cm2/micron', 1e-4],
    ['W/m2/nm', 100],
    ['W m-2 um-1', 0.1],
    ['[erg/s/cm2/A]', 1],
  ];
  for (const [text, scale] of cases) {
    it(`${JSON.stringify(text)} → f_λ × ${scale}`, () => {
      const u = parseFluxUnit(text);
      expect(u?.quantity).toBe('f-lambda');
      expect(u?.unit).toBe(FLUX_LAMBDA);
      expect(u?.raw).toBe(text);
      close(u?.scale, scale);
    });
  }

  it('reads "erg/cm/s/Ang" (the square of cm lost, as older archive files wrote it) as f_λ', () => {
    const u = parseFluxUnit('1.0E-17 erg/cm/s/Ang');
    expect(u?.quantity).toBe('f-lambda');
    close(u?.scale, 1e-17);
  });
});

describe('parseFluxUnit: f_ν spellings, normalised to Jy', () => {
  // 1 Jy = 1e-23 erg s⁻¹ cm⁻² Hz⁻¹ = 1e-26 W m⁻² Hz⁻¹ (IAU definition, from memory).
  const cases: Array<[string, number]> = [
    ['Jy', 1],
    ['jy', 1],
    ['mJy', 1e-3],
    ['µJy', 1e-6],
    ['μJy', 1e-6],
    ['uJy', 1e-6],
    ['microJy', 1e-6],
    ['nJy', 1e-9],
    ['erg/s/cm2/Hz', 1e23],
    ['erg s-1 cm-2 Hz-1', 1e23],
    ['fnu', 1e23],
    ['1e-29 erg/s/cm^2/Hz', 1e-6],
    ['W/m2/Hz', 1e26],
    ['10^-3 Jy', 1e-3],
  ];
  for (const [text, scale] of cases) {
    it(`${JSON.stringify(text)} → f_ν × ${scale} Jy`, () => {
      const u = parseFluxUnit(text);
      expect(u?.quantity).toBe('f-nu');
      expect(u?.unit).toBe(FLUX_NU);
      close(u?.scale, scale);
    });
  }
});

describe('parseFluxUnit: detector units', () => {
  const cases: Array<[string, string, string]> = [
    ['ADU', 'counts', 'ADU'],
    ['adu', 'counts', 'ADU'],
    ['DN', 'counts', 'ADU'],
    ['counts', 'counts', 'counts'],
    ['count', 'counts', 'counts'],
    ['cts', 'counts', 'counts'],
    ['electrons', 'counts', 'electrons'],
    ['e-', 'counts', 'electrons'],
    ['electrons/s', 'count-rate', 'electrons s⁻¹'],
    ['e-/s', 'count-rate', 'electrons s⁻¹'],
    ['electron s-1', 'count-rate', 'electrons s⁻¹'],
    ['counts/s', 'count-rate', 'counts s⁻¹'],
    ['cts s^-1', 'count-rate', 'counts s⁻¹'],
    ['ADU/s', 'count-rate', 'ADU s⁻¹'],
  ];
  for (const [text, quantity, unit] of cases) {
    it(`${JSON.stringify(text)} → ${quantity} in ${unit}`, () => {
      const u = parseFluxUnit(text);
      expect(u).toEqual({ quantity, scale: 1, unit, raw: text });
    });
  }
});

describe('parseFluxUnit: no unit and unknown units', () => {
  for (const text of ['', 'arbitrary', 'Arbitrary units', 'relative flux', 'normalized', 'Normalised', 'unitless', 'dimensionless', 'a.u.']) {
    it(`${JSON.stringify(text)} is an explicit arbitrary unit`, () => {
      expect(parseFluxUnit(text)).toEqual({ quantity: 'arbitrary', scale: 1, unit: 'arbitrary', raw: text });
    });
  }
  for (const text of ['scaled F-lambda units', 'erg/s/cm2', 'erg/s/cm2/A/arcsec2', 'photons/s/cm2/A', 'mag', 'K', 'counts/A', 'erg/s/cm3/Hz', 'Jy/beam', 'erg/s/cm2/A/(', '1e-17']) {
    it(`${JSON.stringify(text)} is not a flux unit Redward reads (null, never a guess)`, () => {
      expect(parseFluxUnit(text)).toBeNull();
    });
  }

  it('treats prototype names as unknown text, not as table entries (fast-check counterexample "__proto__")', () => {
    for (const text of ['__proto__', 'constructor', 'toString']) expect(parseFluxUnit(text)).toBeNull();
  });

  it('never throws, and whatever it returns is a normalised unit with a positive finite scale', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 40 }), (text) => {
        const u = parseFluxUnit(text);
        if (u) expect(Number.isFinite(u.scale) && u.scale > 0).toBe(true);
      }),
    );
  });

  it('a power-of-ten prefix in any spelling is the scale', () => {
    fc.assert(
      fc.property(fc.integer({ min: -30, max: 5 }), fc.constantFrom('1e%', '10^%', '10**(%)', '1.0E%'), (k, form) => {
        const u = parseFluxUnit(`${form.replace('%', String(k))} erg/s/cm2/A`);
        close(u?.scale, 10 ** k);
      }),
    );
  });
});

describe('fluxUnitFromText: units stated by text tables', () => {
  it('reads the unit in the flux column name', () => {
    expect(fluxUnitFromText('flux(1e-17erg/s/cm2/A)', []).scale).toBeCloseTo(1e-17, 30);
    expect(fluxUnitFromText('f_nu[uJy]', [])).toMatchObject({ quantity: 'f-nu', scale: 1e-6 });
  });

  it('reads "flux in …", "flux unit: …", "BUNIT = …" and "units: …" header comments', () => {
    expect(fluxUnitFromText('flux', ['observed spectrum', 'flux in 1e-17 erg/s/cm^2/A'])).toMatchObject({ quantity: 'f-lambda', scale: 1e-17 });
    expect(fluxUnitFromText('flux', ['flux unit: mJy'])).toMatchObject({ quantity: 'f-nu', scale: 1e-3 });
    expect(fluxUnitFromText('f', ["BUNIT = 'ADU'"])).toMatchObject({ quantity: 'counts', unit: 'ADU' });
    expect(fluxUnitFromText('f', ['units: erg/s/cm2/A'])).toMatchObject({ quantity: 'f-lambda', scale: 1 });
    expect(fluxUnitFromText('flux', ['flux (erg s-1 cm-2 A-1)'])).toMatchObject({ quantity: 'f-lambda', scale: 1 });
  });

  it('keeps a stated but unreadable unit as the raw text of an arbitrary unit (real ESI header, Fan et al. 2001 file)', () => {
    expect(fluxUnitFromText('flam', ['wave - wavelength in Agnstroms', 'flam - Flux in scaled F-lambda units', 'sig - uncertainty on flam'])).toEqual({
      quantity: 'arbitrary',
      scale: 1,
      unit: 'arbitrary',
      raw: 'scaled F-lambda units',
    });
  });

  it('"flux is arbitrary units" and a silent file are arbitrary', () => {
    expect(fluxUnitFromText('flux', ['lam is observed wavelengths in Angstroms', 'flux is arbitrary units'])).toMatchObject({ quantity: 'arbitrary', raw: 'arbitrary units' });
    expect(fluxUnitFromText(undefined, [])).toEqual({ quantity: 'arbitrary', scale: 1, unit: 'arbitrary', raw: null });
  });
});
