/**
 * A YAML double-quoted scalar holding exactly `s`, in printable ASCII only: quote and backslash
 * are escaped and every other character outside U+0020–U+007E becomes \xXX, \uXXXX or \UXXXXXXXX
 * (YAML 1.1 and 1.2 escapes). Pure ASCII keeps the ECSV header within APE 6's ASCII header and
 * avoids YAML 1.1's extra line breaks (U+0085, U+2028, U+2029) splitting a value.
 */
export function yamlString(s: string): string {
  let out = '"';
  for (const ch of s) {
    const cp = ch.codePointAt(0)!;
    if (ch === '"' || ch === '\\') out += '\\' + ch;
    else if (cp >= 0x20 && cp <= 0x7e) out += ch;
    else if (cp <= 0xff) out += '\\x' + hex(cp, 2);
    else if (cp <= 0xffff) out += '\\u' + hex(cp, 4);
    else out += '\\U' + hex(cp, 8);
  }
  return out + '"';
}

const hex = (n: number, width: number) => n.toString(16).toUpperCase().padStart(width, '0');

/**
 * A YAML number that YAML 1.1 loaders (PyYAML, which astropy uses) also read as a number: their
 * float pattern needs a '.' in the mantissa and a signed exponent, so 1e-7 is written 1.0e-7.
 */
export function yamlNumber(x: number): string {
  if (!Number.isFinite(x)) throw new RangeError(`YAML metadata needs finite numbers, got ${x}.`);
  const s = String(x);
  if (!s.includes('e')) return s;
  const [mantissa, exponent] = s.split('e') as [string, string];
  return `${mantissa.includes('.') ? mantissa : mantissa + '.0'}e${exponent}`;
}
