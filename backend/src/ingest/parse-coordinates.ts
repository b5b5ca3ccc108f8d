/**
 * Right ascension in degrees from decimal degrees ("160.5146") or sexagesimal hours
 * ("10:42:03.5", "10 42 03.5", "10h42m03.5s"). Null when the text is not a valid RA.
 *
 * @example parseRa('10:42:03.5') // 160.514583…
 */
export function parseRa(text: string): number | null {
  const t = text.trim();
  if (isDecimal(t)) {
    const deg = Number(t);
    return deg >= 0 && deg < 360 ? deg : null;
  }
  const parts = sexagesimal(t);
  if (!parts || parts.sign < 0) return null;
  const [h, m, s] = parts.values;
  if (h >= 24 || m >= 60 || s >= 60) return null;
  return (h + m / 60 + s / 3600) * 15;
}

/**
 * Declination in degrees from decimal degrees ("-11.6333") or sexagesimal degrees
 * ("-11:38:00", "−11 38 00", "-11d38m00s"). The sign applies to the whole value, so
 * "-00:30:00" is −0.5°. Null when the text is not a valid declination.
 *
 * @example parseDec('-11:38:00') // −11.6333…
 */
export function parseDec(text: string): number | null {
  const t = text.trim().replace('\u2212', '-');
  if (isDecimal(t)) {
    const deg = Number(t);
    return deg >= -90 && deg <= 90 ? deg : null;
  }
  const parts = sexagesimal(t);
  if (!parts) return null;
  const [d, m, s] = parts.values;
  if (m >= 60 || s >= 60) return null;
  const deg = parts.sign * (d + m / 60 + s / 3600);
  return deg >= -90 && deg <= 90 ? deg : null;
}

function isDecimal(t: string): boolean {
  return /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(t);
}

function sexagesimal(t: string): { sign: 1 | -1; values: [number, number, number] } | null {
  const m = /^([+-])?\s*(\d{1,3})[\s:hd°]+(\d{1,2})[\s:m']+(\d{1,2}(?:\.\d*)?)\s*[s"]?$/.exec(t.replace('\u2212', '-'));
  if (!m) return null;
  return { sign: m[1] === '-' ? -1 : 1, values: [Number(m[2]), Number(m[3]), Number(m[4])] };
}
