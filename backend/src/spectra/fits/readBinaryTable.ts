import { SpectrumReadError } from '../errors';
import { checkPixelCount } from '../spectrumLimits';
import { num, str } from './parseHeader';
import type { FitsHdu } from './listHdus';

/** One numeric column, flattened row-major (row 0's cells first). */
export interface TableColumn {
  name: string;
  unit: string;
  /** Elements per row (the repeat count of TFORM). */
  repeat: number;
  values: Float64Array;
}

const SIZES: Record<string, number> = { L: 1, X: 1, B: 1, I: 2, J: 4, K: 8, A: 1, E: 4, D: 8, C: 8, M: 16, P: 8, Q: 16 };

/**
 * Decodes the numeric columns (TFORM B, I, J, K, E, D) of a binary table (FITS 4.0 §7.3), applying
 * TSCAL/TZERO and TNULL. Other column types are skipped but their widths are honoured so the
 * following columns stay aligned.
 */
export function readBinaryTable(bytes: Uint8Array, hdu: FitsHdu): TableColumn[] {
  const h = hdu.header;
  const rowBytes = hdu.axes[0] ?? 0;
  const rows = hdu.axes[1] ?? 0;
  const fields = num(h, 'TFIELDS') ?? 0;
  if (!Number.isInteger(fields) || fields < 0 || fields > 999) {
    throw new SpectrumReadError('fits-table', `HDU ${hdu.index}: TFIELDS is not an integer between 0 and 999.`);
  }
  // The table proper must fit in the HDU's data, and the heap (PCOUNT bytes at THEAP) after it (FITS 4.0 §7.3.5).
  if (rows * rowBytes > hdu.dataBytes) {
    throw new SpectrumReadError('fits-table', `HDU ${hdu.index}: NAXIS1 × NAXIS2 = ${rowBytes} × ${rows} bytes do not fit in the ${hdu.dataBytes} bytes of data.`);
  }
  const theap = h.values.get('THEAP');
  const pcount = num(h, 'PCOUNT') ?? 0;
  if (theap !== undefined && !(typeof theap === 'number' && Number.isInteger(theap) && theap >= rows * rowBytes && theap <= rows * rowBytes + pcount)) {
    throw new SpectrumReadError('fits-table', `HDU ${hdu.index}: THEAP = ${String(theap)} is not a byte offset between the end of the table (${rows * rowBytes}) and the end of the heap (${rows * rowBytes + pcount}).`);
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset + hdu.dataOffset, hdu.dataBytes);
  const columns: TableColumn[] = [];
  let offset = 0;
  for (let f = 1; f <= fields; f++) {
    const tform = (str(h, `TFORM${f}`) ?? '').trim().toUpperCase();
    const match = /^(\d*)([LXBIJKAEDCMPQ])/.exec(tform);
    if (!match) throw new SpectrumReadError('fits-table', `HDU ${hdu.index}: TFORM${f} = '${tform}' is not a binary-table format.`);
    const repeat = match[1] === '' ? 1 : Number(match[1]);
    const code = match[2]!;
    if (!Number.isSafeInteger(repeat) || repeat > rowBytes * 8) {
      throw new SpectrumReadError('fits-table', `HDU ${hdu.index}: TFORM${f} = '${tform}' repeats ${match[1]} times, more than a row of NAXIS1 = ${rowBytes} bytes can hold.`);
    }
    const width = code === 'X' ? Math.ceil(repeat / 8) : code === 'P' || code === 'Q' ? SIZES[code]! : repeat * SIZES[code]!;
    if (offset + width > rowBytes) {
      throw new SpectrumReadError('fits-table', `HDU ${hdu.index}: column ${f} (TFORM${f} = '${tform}') runs past the row width NAXIS1 = ${rowBytes}.`);
    }
    if ('BIJKED'.includes(code) && repeat > 0) {
      checkPixelCount(rows * repeat, `FITS HDU ${hdu.index} binary table`, `values in column ${f} (NAXIS2 × repeat of TFORM${f} = ${rows} × ${repeat})`);
      const scale = num(h, `TSCAL${f}`) ?? 1;
      const zero = num(h, `TZERO${f}`) ?? 0;
      const tnull = num(h, `TNULL${f}`);
      const size = SIZES[code]!;
      const values = new Float64Array(rows * repeat);
      for (let r = 0; r < rows; r++) {
        for (let e = 0; e < repeat; e++) {
          const at = r * rowBytes + offset + e * size;
          let v: number;
          switch (code) {
            case 'B': v = view.getUint8(at); break;
            case 'I': v = view.getInt16(at); break;
            case 'J': v = view.getInt32(at); break;
            case 'K': v = Number(view.getBigInt64(at)); break;
            case 'E': v = view.getFloat32(at); break;
            default: v = view.getFloat64(at);
          }
          const isNull = code !== 'E' && code !== 'D' && tnull !== undefined && v === tnull;
          values[r * repeat + e] = isNull ? NaN : v * scale + zero;
        }
      }
      columns.push({
        name: (str(h, `TTYPE${f}`) ?? `COL${f}`).trim(),
        unit: (str(h, `TUNIT${f}`) ?? '').trim(),
        repeat,
        values,
      });
    }
    offset += width;
  }
  return columns;
}
