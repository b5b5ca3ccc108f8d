const pad = (v: number, width: number, digits: number) => v.toFixed(digits).padStart(width + (digits ? digits + 1 : 0), '0');

/**
 * Sexagesimal coordinates from degrees: RA in hours (h:m:s to 0.01 s), Dec in degrees (to 0.1″).
 *
 * @example formatRa(160.522665) // "10:42:05.44"
 * @example formatDec(-11.630829) // "−11:37:51.0"
 */
export function formatRa(deg: number): string {
  let s = (((deg % 360) + 360) % 360) / 15 * 3600;
  s = Math.round(s * 100) / 100;
  const h = Math.floor(s / 3600);
  const m = Math.floor((s - h * 3600) / 60);
  const sec = s - h * 3600 - m * 60;
  return `${pad(h % 24, 2, 0)}:${pad(m, 2, 0)}:${pad(sec, 2, 2)}`;
}

export function formatDec(deg: number): string {
  const sign = deg < 0 ? '−' : '+';
  let s = Math.round(Math.abs(deg) * 3600 * 10) / 10;
  const d = Math.floor(s / 3600);
  s -= d * 3600;
  const m = Math.floor(s / 60);
  const sec = s - m * 60;
  return `${sign}${pad(d, 2, 0)}:${pad(m, 2, 0)}:${pad(sec, 2, 1)}`;
}
