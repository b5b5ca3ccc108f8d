import { SpectrumReadError } from '../errors';
import { angstromsPer, guessAngstromsPer } from '../columnRoles';
import { checkWavelengths } from '../spectrumLimits';
import { num, str, type FitsHeader } from './parseHeader';

/**
 * Wavelength (Å, as written: air or vacuum) of each pixel along axis 1 of an image HDU, from:
 * - FITS WCS (Greisen et al. 2006, Paper III): CRVAL1, CDELT1 or CD1_1, CRPIX1, CTYPE1 WAVE/AWAV
 *   (linear) or WAVE-LOG/AWAV-LOG (λ = CRVAL1·exp(CDELT1·(p − CRPIX1)/CRVAL1)), CUNIT1;
 * - the older log-linear conventions: DC-FLAG = 1 (CRVAL1/CDELT1 are log10 Å) and COEFF0/COEFF1
 *   (log10 Å of pixel 0 and step).
 * Returns undefined when the header carries no dispersion keywords at all. Notes for the reader
 * (e.g. an axis moved to the rest frame) are pushed to `notes`.
 */
export function imageWavelengths(header: FitsHeader, n: number, hduIndex: number, fallback?: FitsHeader, notes: string[] = []): Float64Array | undefined {
  const axis = axisWavelengths(header, n, hduIndex, fallback, notes);
  if (axis) checkWavelengths(axis.values, `FITS HDU ${hduIndex} image`, (i) => `pixel ${i + 1} (from ${axis.keywords})`);
  return axis?.values;
}

function axisWavelengths(header: FitsHeader, n: number, hduIndex: number, fallback: FitsHeader | undefined, notes: string[]): { values: Float64Array; keywords: string } | undefined {
  const get = (k: string) => num(header, k) ?? (fallback ? num(fallback, k) : undefined);
  const gets = (k: string) => str(header, k) ?? (fallback ? str(fallback, k) : undefined);
  const out = new Float64Array(n);
  const coeff0 = get('COEFF0');
  const coeff1 = get('COEFF1');
  const crval = get('CRVAL1');
  const cdelt = get('CDELT1') ?? get('CD1_1');
  // The standard keywords win over COEFF0/COEFF1: SDSS writes both in agreement, but a later tool
  // (e.g. IRAF re-dispersing or shifting a spectrum) rewrites CRVAL1/CD1_1 and leaves COEFFn stale.
  if (crval === undefined || cdelt === undefined) {
    if (coeff0 === undefined || coeff1 === undefined) return undefined;
    for (let i = 0; i < n; i++) out[i] = 10 ** (coeff0 + coeff1 * i);
    return { values: out, keywords: 'COEFF0/COEFF1' };
  }
  if (cdelt === 0) throw new SpectrumReadError('fits-wcs', `HDU ${hduIndex}: CDELT1/CD1_1 is zero, so pixels have no wavelength step.`);
  const crpix = get('CRPIX1') ?? 1;
  const ctype = (gets('CTYPE1') ?? '').trim().toUpperCase();
  const dcFlag = get('DC-FLAG');
  const isLog10 = dcFlag === 1 || (ctype === 'LINEAR' && dcFlag === 1);
  const isWaveLog = ctype.endsWith('-LOG');
  for (let p = 1; p <= n; p++) {
    const x = cdelt * (p - crpix);
    out[p - 1] = isLog10 ? 10 ** (crval + x) : isWaveLog ? crval * Math.exp(x / crval) : crval + x;
  }
  const factor = unitFactor(gets('CUNIT1'), gets('WAT1_001'), ctype, out[n >> 1]!);
  if (factor !== 1) for (let i = 0; i < n; i++) out[i]! *= factor;
  if (coeff0 !== undefined && coeff1 !== undefined && n > 1) {
    const observed = restFrameShift(out, coeff0, coeff1, get('Z'));
    if (observed) {
      notes.push(
        `CRVAL1/CD1_1 give the source's rest frame: the SDSS axis COEFF0/COEFF1 is longer by 1 + Z = ${(1 + get('Z')!).toFixed(5)} at both ends, ` +
          'as after a Doppler correction to the header redshift. The axis was multiplied by 1 + Z back to observed wavelengths, because a redshift is measured on those.',
      );
      return { values: observed, keywords: 'CRVAL1/CD1_1 × (1 + Z)' };
    }
  }
  return { values: out, keywords: `CRVAL1 = ${crval}, ${get('CDELT1') !== undefined ? 'CDELT1' : 'CD1_1'} = ${cdelt}, CRPIX1 = ${crpix}` };
}

/**
 * The standard axis times 1 + Z when it is the COEFF0/COEFF1 (observed) range divided by 1 + Z of
 * the header — a spectrum Doppler-corrected to its catalogued redshift (and perhaps re-dispersed
 * onto a linear axis, so only the ends can be compared); else undefined. Both ends must agree to
 * 0.01 %, so a re-dispersed but unshifted axis does not match.
 */
function restFrameShift(wcs: Float64Array, coeff0: number, coeff1: number, z: number | undefined): Float64Array | undefined {
  if (z === undefined || !(z > 0.001)) return undefined;
  const n = wcs.length;
  const first = 10 ** coeff0;
  const last = 10 ** (coeff0 + coeff1 * (n - 1));
  const ratioFirst = first / wcs[0]!;
  const ratioLast = last / wcs[n - 1]!;
  if (Math.abs(ratioFirst - (1 + z)) > 1e-4 * (1 + z) || Math.abs(ratioLast - (1 + z)) > 1e-4 * (1 + z)) return undefined;
  return Float64Array.from(wcs, (w) => w * (1 + z));
}

function unitFactor(cunit: string | undefined, wat: string | undefined, ctype: string, median: number): number {
  if (cunit) {
    const f = angstromsPer(cunit);
    if (f !== undefined) return f;
  }
  const watUnits = wat ? /units=(\S+)/i.exec(wat) : null;
  if (watUnits) {
    const f = angstromsPer(watUnits[1]!);
    if (f !== undefined) return f;
  }
  // Paper III makes metres the default unit of WAVE/AWAV, but many writers omit CUNIT1 and
  // mean Å; trust the magnitude of the numbers instead of the letter of the standard.
  void ctype;
  return guessAngstromsPer(Math.abs(median));
}
