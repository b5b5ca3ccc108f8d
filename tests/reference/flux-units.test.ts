import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gunzipSync } from 'fflate';
import { describe, expect, it } from 'vitest';
import { listHdus } from '../../backend/src/spectra/fits/listHdus';
import { readSpectrum } from '../../backend/src/spectra/readSpectrum';

// Every real file of ../shared/real-spectra (MANIFEST.tsv names the sources): a FITS file whose
// headers carry a unit card for its flux (BUNIT, or TUNITn of the flux column) must get a unit
// Redward names; every other file is 'arbitrary', never a guessed unit.
const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..', '..', 'shared', 'real-spectra');
const present = existsSync(join(root, 'MANIFEST.tsv'));
const files = present
  ? readdirSync(root, { recursive: true, withFileTypes: true })
      .filter((d) => d.isFile() && !['MANIFEST.tsv', 'README.md', 'Selsing2015_ReadMe.txt'].includes(d.name))
      .map((d) => join(d.parentPath, d.name).slice(root.length + 1))
      .sort()
  : [];
const isFits = (f: string) => /\.(fits?|fts)(\.gz)?$/i.test(f);

/** The unit card a FITS file gives its flux, read here independently of the reader. */
function unitCard(bytes: Uint8Array, fluxColumn: string): string | null {
  for (const hdu of listHdus(bytes)) {
    const v = hdu.header.values;
    for (let i = 1; i <= 999 && v.has(`TTYPE${i}`); i++) {
      if (String(v.get(`TTYPE${i}`)).trim() === fluxColumn && typeof v.get(`TUNIT${i}`) === 'string' && String(v.get(`TUNIT${i}`)).trim() !== '') return String(v.get(`TUNIT${i}`));
    }
  }
  for (const hdu of listHdus(bytes)) {
    const b = hdu.header.values.get('BUNIT');
    if (typeof b === 'string' && b.trim() !== '') return b;
  }
  return null;
}

describe.skipIf(!present)('flux units of the real spectra', () => {
  it('every FITS file with a flux unit card gets a recognised unit, the rest arbitrary', () => {
    const table: string[] = [];
    let withCard = 0;
    for (const f of files) {
      let bytes = new Uint8Array(readFileSync(join(root, f)));
      if (f.endsWith('.gz')) bytes = gunzipSync(bytes);
      const s = readSpectrum(bytes);
      const card = isFits(f) ? unitCard(bytes, s.meta.columns.flux ?? '') : null;
      table.push(`${f.padEnd(48)} ${JSON.stringify(card ?? s.fluxUnit.raw).padEnd(34)} → ${s.fluxUnit.quantity} × ${s.fluxUnit.scale} ${s.fluxUnit.unit}`);
      // A text header may state a unit no one can convert ("scaled F-lambda units"): it is quoted in a warning.
      if (isFits(f)) expect(s.meta.warnings.some((w) => w.includes('flux unit')), f).toBe(false);
      if (card !== null) {
        withCard++;
        expect(s.fluxUnit.quantity, `${f}: ${card}`).not.toBe('arbitrary');
        expect(s.fluxUnit.raw, f).toBe(card);
      } else if (isFits(f)) {
        expect(s.fluxUnit, f).toEqual({ quantity: 'arbitrary', scale: 1, unit: 'arbitrary', raw: null });
      } else {
        expect(s.fluxUnit.quantity, f).toBe('arbitrary');
      }
    }
    console.log(table.join('\n'));
    expect(withCard).toBeGreaterThan(60);
  });

  it('known files: SDSS 1e-17 f_λ, the XQ-100 table per nm, the KC96 templates in flam, the ESI text file "scaled"', () => {
    const unitOf = (f: string) => {
      let bytes = new Uint8Array(readFileSync(join(root, f)));
      if (f.endsWith('.gz')) bytes = gunzipSync(bytes);
      return readSpectrum(bytes).fluxUnit;
    };
    // BUNIT = '1E-17 erg/cm^2/s/Ang' in SDSS spec files (the card as written in the file).
    expect(unitOf('sdss/spec-0266-51602-0001.fits')).toMatchObject({ quantity: 'f-lambda', scale: 1e-17 });
    // Older SDSS files write '1.0E-17 erg/cm/s/Ang' (cm² meant).
    expect(unitOf('sdss/spSpec-51630-0266-637.fit')).toMatchObject({ quantity: 'f-lambda', scale: 1e-17 });
    // TUNIT 'erg s**(-1) cm**(-2) nm**(-1)': per nm is 0.1 × per Å.
    expect(unitOf('highz/XShooter_XQ100.fits.gz')).toMatchObject({ quantity: 'f-lambda', scale: 0.1 });
    expect(unitOf('composites/KC96_sb_template.fits')).toMatchObject({ quantity: 'f-lambda', scale: 1, raw: 'flam' });
    // No unit card at all in the XQR-30 tables: arbitrary, even though the values look like cgs f_λ.
    expect(unitOf('highz_xqr30/PSOJ007+04_VIS.fits')).toEqual({ quantity: 'arbitrary', scale: 1, unit: 'arbitrary', raw: null });
    expect(unitOf('highz/J0836+0054_ESI.txt')).toMatchObject({ quantity: 'arbitrary', raw: 'scaled F-lambda units' });
  });
});
