/** Test helper: writes FITS bytes card by card (FITS 4.0: 80-character cards, 2880-byte blocks). */
export type Card = [string, string | number | boolean];

export function card(key: string, value: string | number | boolean): string {
  const v = typeof value === 'string' ? `'${value.padEnd(8)}'` : typeof value === 'boolean' ? (value ? 'T' : 'F') : String(value);
  const text = `${key.padEnd(8)}= ${typeof value === 'string' ? v : v.padStart(20)}`;
  return text.padEnd(80).slice(0, 80);
}

export function header(cards: Card[]): Uint8Array {
  const lines = cards.map(([k, v]) => card(k, v));
  lines.push('END'.padEnd(80));
  const blocks = Math.ceil((lines.length * 80) / 2880);
  const text = lines.join('').padEnd(blocks * 2880, ' ');
  return Uint8Array.from(text, (c) => c.charCodeAt(0));
}

export function padData(data: Uint8Array): Uint8Array {
  const out = new Uint8Array(Math.ceil(data.length / 2880) * 2880);
  out.set(data);
  return out;
}

export function float32BE(values: number[]): Uint8Array {
  const out = new Uint8Array(values.length * 4);
  const view = new DataView(out.buffer);
  values.forEach((v, i) => view.setFloat32(i * 4, v));
  return out;
}

export function concat(...parts: Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((a, p) => a + p.length, 0));
  let o = 0;
  for (const p of parts) {
    out.set(p, o);
    o += p.length;
  }
  return out;
}
