import { describe, expect, it } from 'vitest';
import { CatalogueError, readPhotometryTable } from '../../../backend/src/photoz/photometryCatalogue';

const known = new Set(['acs_wfc_f435w', 'wfc3_ir_f160w']);
const header = ['id', 'ra', 'flux_acs_wfc_f435w', 'err_acs_wfc_f435w', 'flux_wfc3_ir_f160w', 'err_wfc3_ir_f160w'];

function refusal(rows: string[][]): CatalogueError {
  try {
    readPhotometryTable(rows, known);
  } catch (e) {
    expect(e).toBeInstanceOf(CatalogueError);
    return e as CatalogueError;
  }
  throw new Error('the catalogue was accepted');
}

describe('readPhotometryTable', () => {
  it('keeps non-detections (zero and negative flux) as measurements and marks a band left empty as not observed', () => {
    const t = readPhotometryTable([header, ['a', '1.0', '-3.5', '2', '120', '4'], ['b', '1.1', '0', '2', '', ''], ['']], known);
    expect(t.ids).toEqual(['a', 'b']);
    expect(t.bands).toEqual(['acs_wfc_f435w', 'wfc3_ir_f160w']);
    expect(Array.from(t.flux.subarray(0, 3))).toEqual([-3.5, 120, 0]);
    expect(Number.isNaN(t.flux[3])).toBe(true);
    expect(Array.from(t.err.subarray(0, 3))).toEqual([2, 4, 2]);
    expect(t.lines).toEqual([2, 3]);
  });

  it('names an unknown filter column', () => {
    const e = refusal([[...header, 'flux_nircam_f999w', 'err_nircam_f999w'], ['a', '1', '1', '1', '1', '1', '1', '1']]);
    expect(e.column).toBe('flux_nircam_f999w');
    expect(e.message).toMatch(/column "flux_nircam_f999w": unknown filter "nircam_f999w"/);
  });

  it('names a missing error column (and a missing flux column)', () => {
    expect(refusal([header.slice(0, 5), ['a', '1', '1', '1', '1']]).message).toMatch(/"flux_wfc3_ir_f160w" has no error column "err_wfc3_ir_f160w"/);
    expect(refusal([['id', 'err_wfc3_ir_f160w'], ['a', '1']]).column).toBe('flux_wfc3_ir_f160w');
  });

  it('names the column and line of a non-numeric cell, a bad error and a half-empty pair', () => {
    let e = refusal([header, ['a', '1', '1', '1', '1', '1'], ['b', '1', '1', '1', 'n/a', '1']]);
    expect(e.line).toBe(3);
    expect(e.column).toBe('flux_wfc3_ir_f160w');
    expect(e.message).toBe('line 3 (id b), column flux_wfc3_ir_f160w: "n/a" is not a number');
    e = refusal([header, ['a', '1', '1', '0', '1', '1']]);
    expect(e.message).toMatch(/line 2 \(id a\), column err_acs_wfc_f435w: the error must be positive, got 0/);
    e = refusal([header, ['a', '1', '1', '1', '5', '']]);
    expect(e.message).toMatch(/column err_wfc3_ir_f160w: empty while its flux is given/);
  });

  it('refuses a catalogue without id, without bands, an empty id and a short row', () => {
    expect(refusal([['name', 'flux_wfc3_ir_f160w', 'err_wfc3_ir_f160w']]).message).toMatch(/no "id" column/);
    expect(refusal([['id', 'ra']]).message).toMatch(/no flux_<filter>/);
    expect(refusal([header, [' ', '1', '1', '1', '1', '1']]).message).toMatch(/line 2: empty id/);
    expect(refusal([header, ['a', '1', '1']]).message).toMatch(/line 2 \(id a\): 3 cells where the header has 6/);
    expect(refusal([]).message).toMatch(/empty/);
  });
});
