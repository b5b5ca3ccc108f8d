import { gzipSync } from 'fflate';
import { mulberry32 } from '../spectra/seededRandom';

/** A seeded generator of uniform numbers in [0, 1), so a case number names one mutation for ever. */
export const seededRandom = mulberry32;

export type MutationKind = 'truncate' | 'flip-bits' | 'duplicate-region' | 'absurd-header' | 'non-finite' | 'huge-size' | 'gzip';

export interface Mutation {
  kind: MutationKind;
  /** What was done, enough to redo it by hand ("flipped 3 bits at 1200, 5000, 7001"). */
  detail: string;
  bytes: Uint8Array;
}

const CARD = 80;
/** Header keywords whose values decide sizes, layout or the wavelength axis. */
const SIZE_KEYS = /^(BITPIX|NAXIS\d*|PCOUNT|GCOUNT|THEAP|TFIELDS|TFORM\d+|CRVAL1|CDELT1|CD1_1|CRPIX1|COEFF[01]|DC-FLAG|BSCALE|BZERO|TSCAL\d+|TZERO\d+|CUNIT1|CTYPE1|Z)$/;
const ABSURD_VALUES = ['1E308', '-1', '0', '2147483647', '99999999999999999999', '1E-320', '-1E308', '4.5', "'1000000000E'", "'ABC'", 'NAN', '9007199254740993', '-2147483648'];
const NON_FINITE_TEXT = ['nan', 'NaN', 'inf', '-inf', 'Infinity', '1e308', '-1e308', '1e-320', '0', '-0', '1e999', '-1e999', '7e300'];
/** Big-endian float patterns: NaN, ±Inf, the largest float32 and float64, a denormal. */
const NON_FINITE_WORDS = [
  [0x7f, 0xc0, 0x00, 0x00],
  [0x7f, 0x80, 0x00, 0x00],
  [0xff, 0x80, 0x00, 0x00],
  [0x7f, 0x7f, 0xff, 0xff],
  [0xff, 0x7f, 0xff, 0xff],
  [0x7f, 0xef, 0xff, 0xff, 0xff, 0xff, 0xff, 0xff],
  [0x7f, 0xf8, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00],
  [0x00, 0x00, 0x00, 0x01],
];

function isFits(b: Uint8Array): boolean {
  return b.length >= 9 && String.fromCharCode(...b.subarray(0, 9)) === 'SIMPLE  =';
}

/** Offsets of header cards (start of each 80-byte card) whose keyword matches `keys`, over all HDUs' first blocks. */
function headerCards(b: Uint8Array, keys: RegExp): number[] {
  const out: number[] = [];
  // Headers are ASCII; scanning every card boundary of the file finds the cards of every HDU.
  for (let at = 0; at + CARD <= b.length; at += CARD) {
    if (b[at + 8] !== 0x3d || b[at + 9] !== 0x20) continue;
    let key = '';
    for (let k = 0; k < 8; k++) key += String.fromCharCode(b[at + k]!);
    if (keys.test(key.trimEnd())) out.push(at);
  }
  return out;
}

function writeCardValue(b: Uint8Array, at: number, value: string): void {
  const text = value.padStart(20, ' ').padEnd(70, ' ');
  for (let k = 0; k < 70; k++) b[at + 10 + k] = text.charCodeAt(k);
}

const int = (rnd: () => number, n: number) => Math.floor(rnd() * n);

/**
 * One hostile variant of a real spectrum file: a truncation, flipped bits, a duplicated byte
 * region, an absurd header value (FITS) or wavelength (text), non-finite numbers written into
 * the data, a huge size (a header claiming more pixels, or a text table grown to 10⁵–10⁶ rows),
 * or a gzip wrapper around one of these. Deterministic for a given `rnd` state.
 */
export function mutateSpectrum(original: Uint8Array, rnd: () => number): Mutation {
  const r = rnd();
  const kind: MutationKind = r < 0.14 ? 'truncate' : r < 0.3 ? 'flip-bits' : r < 0.46 ? 'duplicate-region' : r < 0.64 ? 'absurd-header' : r < 0.86 ? 'non-finite' : r < 0.93 ? 'huge-size' : 'gzip';
  const n = original.length;
  switch (kind) {
    case 'truncate': {
      const cut = int(rnd, n);
      return { kind, detail: `cut at byte ${cut} of ${n}`, bytes: original.slice(0, cut) };
    }
    case 'flip-bits': {
      const b = original.slice();
      const count = 1 + int(rnd, 32);
      const at: number[] = [];
      for (let i = 0; i < count; i++) {
        const pos = int(rnd, n);
        b[pos]! ^= 1 << int(rnd, 8);
        at.push(pos);
      }
      return { kind, detail: `flipped ${count} bits at ${at.slice(0, 6).join(', ')}${count > 6 ? '…' : ''}`, bytes: b };
    }
    case 'duplicate-region': {
      const len = 1 + int(rnd, Math.min(n, 1 + int(rnd, 20000)));
      const from = int(rnd, n - len + 1);
      const to = int(rnd, n + 1);
      const overwrite = rnd() < 0.5;
      const out = overwrite ? original.slice() : new Uint8Array(n + len);
      if (overwrite) out.set(original.subarray(from, from + Math.min(len, n - to)), to);
      else {
        out.set(original.subarray(0, to), 0);
        out.set(original.subarray(from, from + len), to);
        out.set(original.subarray(to), to + len);
      }
      return { kind, detail: `${overwrite ? 'copied over' : 'inserted'} ${len} bytes from ${from} at ${to}`, bytes: out };
    }
    case 'absurd-header': {
      if (isFits(original)) {
        const cards = headerCards(original, SIZE_KEYS);
        const b = original.slice();
        const count = 1 + int(rnd, 2);
        const done: string[] = [];
        for (let i = 0; i < count && cards.length > 0; i++) {
          const at = cards[int(rnd, cards.length)]!;
          const value = ABSURD_VALUES[int(rnd, ABSURD_VALUES.length)]!;
          writeCardValue(b, at, value);
          done.push(`${String.fromCharCode(...b.subarray(at, at + 8)).trim()} = ${value}`);
        }
        return { kind, detail: done.join(', ') || 'no size cards', bytes: b };
      }
      return mutateTextNumbers(original, rnd, kind, true);
    }
    case 'non-finite': {
      if (isFits(original)) {
        const b = original.slice();
        const count = 1 + int(rnd, rnd() < 0.3 ? 2000 : 40);
        // Header blocks hold the cards; aim at the data: anything past the first header block.
        const start = Math.min(n - 8, 2880);
        for (let i = 0; i < count; i++) {
          const word = NON_FINITE_WORDS[int(rnd, NON_FINITE_WORDS.length)]!;
          const at = start + 4 * int(rnd, Math.max(1, (n - start - 8) / 4));
          b.set(word, at);
        }
        return { kind, detail: `${count} non-finite words written into the data`, bytes: b };
      }
      return mutateTextNumbers(original, rnd, kind, false);
    }
    case 'huge-size': {
      if (isFits(original)) {
        const cards = headerCards(original, /^NAXIS[12]$/);
        const b = original.slice();
        if (cards.length === 0) return { kind, detail: 'no NAXIS card', bytes: b };
        const at = cards[int(rnd, cards.length)]!;
        const value = String([10_000_000, 2 ** 31, 2 ** 53, 1e15, 123_456_789][int(rnd, 5)]);
        writeCardValue(b, at, value);
        return { kind, detail: `${String.fromCharCode(...b.subarray(at, at + 8)).trim()} = ${value}`, bytes: b };
      }
      return growText(original, rnd);
    }
    case 'gzip': {
      const inner = mutateSpectrum(original, rnd);
      const gz = gzipSync(inner.bytes, { level: 1 });
      if (rnd() < 0.5) {
        const pos = int(rnd, gz.length);
        gz[pos]! ^= 1 << int(rnd, 8);
        return { kind, detail: `gzip of (${inner.kind}: ${inner.detail}), 1 bit flipped at ${pos}`, bytes: gz };
      }
      return { kind, detail: `gzip of (${inner.kind}: ${inner.detail})`, bytes: gz };
    }
  }
}

/** Replaces numbers of a text table by non-finite or absurd tokens (wavelengths only, or any column). */
function mutateTextNumbers(original: Uint8Array, rnd: () => number, kind: MutationKind, firstColumnOnly: boolean): Mutation {
  const lines = new TextDecoder().decode(original).split('\n');
  const data = lines.map((l, i) => (/^\s*[-+0-9.]/.test(l) ? i : -1)).filter((i) => i >= 0);
  if (data.length === 0) return { kind, detail: 'no numeric lines', bytes: original };
  const many = rnd() < 0.3;
  const count = many ? 1 + int(rnd, data.length) : 1 + int(rnd, 5);
  for (let k = 0; k < count; k++) {
    const li = data[int(rnd, data.length)]!;
    const tokens = lines[li]!.trim().split(/(\s+|,)/);
    const numeric = tokens.map((t, i) => (/^[-+0-9.]/.test(t) ? i : -1)).filter((i) => i >= 0);
    if (numeric.length === 0) continue;
    const target = firstColumnOnly ? numeric[0]! : numeric[int(rnd, numeric.length)]!;
    tokens[target] = NON_FINITE_TEXT[int(rnd, NON_FINITE_TEXT.length)]!;
    lines[li] = tokens.join('');
  }
  return { kind, detail: `${count} ${firstColumnOnly ? 'wavelengths' : 'numbers'} replaced by non-finite or absurd values`, bytes: new TextEncoder().encode(lines.join('\n')) };
}

/** A text table re-sampled onto 10⁵–10⁶ rows over its own wavelength range (nearest-row flux). */
function growText(original: Uint8Array, rnd: () => number): Mutation {
  const lines = new TextDecoder().decode(original).split('\n');
  const rows = lines.filter((l) => /^\s*[-+0-9.]/.test(l)).map((l) => l.trim().split(/[\s,]+/).map(Number));
  const good = rows.filter((r) => r.length >= 2 && Number.isFinite(r[0]!));
  if (good.length < 2) return { kind: 'huge-size', detail: 'no numeric rows', bytes: original };
  const target = rnd() < 0.2 ? 1_000_000 : 100_000 + int(rnd, 200_000);
  const lo = good[0]![0]!;
  const hi = good[good.length - 1]![0]!;
  const out: string[] = ['# wavelength flux error'];
  for (let i = 0; i < target; i++) {
    const src = good[Math.floor((i * good.length) / target)]!;
    out.push(`${(lo + ((hi - lo) * i) / (target - 1)).toFixed(5)} ${src[1]} ${src[2] ?? 1}`);
  }
  return { kind: 'huge-size', detail: `grown to ${target} rows`, bytes: new TextEncoder().encode(out.join('\n')) };
}
