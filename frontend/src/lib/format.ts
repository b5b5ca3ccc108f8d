/**
 * Display helpers for the trade's numbers. Values are shown as stored, never rounded
 * into something the lead did not set.
 */

export const formatRedshiftRange = (zMin: number, zMax: number) => `${zMin} ≤ z ≤ ${zMax}`;

export const formatTolerance = (tolerance: number) => `|Δz|/(1+z) ≤ ${tolerance}`;

/** A campaign's scan grid in words: 'default' is 1e-4 dex, i.e. 69 km/s per pixel. */
export const GRID_STEP_LABELS = { default: '69 km/s pixels (default)', native: "Each file's own sampling" } as const;

export const formatGridStep = (gridStep: keyof typeof GRID_STEP_LABELS) => (gridStep === 'native' ? "each file's own sampling" : '69 km/s pixels');

const pad = (n: number) => String(n).padStart(2, '0');

/** UTC, ISO-like: collaborators sit in many time zones and observing logs are kept in UTC. */
export function formatDateTime(iso: string | null | undefined): string {
  if (!iso) return '—';
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())} ${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())} UTC`;
}

export function formatDate(iso: string | null | undefined): string {
  if (!iso) return '—';
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())}`;
}

export const ROLE_LABELS = { lead: 'Lead', reader: 'Reader', observer: 'Observer' } as const;

/** File sizes in the units a person sees in their file manager (1 kB = 1000 bytes). */
export function formatBytes(bytes: number): string {
  if (bytes < 1000) return `${bytes} B`;
  const units = ['kB', 'MB', 'GB', 'TB'];
  let value = bytes;
  let unit = -1;
  while (value >= 1000 && unit < units.length - 1) {
    value /= 1000;
    unit += 1;
  }
  return `${value.toFixed(value < 10 ? 2 : value < 100 ? 1 : 0)} ${units[unit]}`;
}

/** Sky positions to 5 decimals of a degree (0.036″): finer than any fibre or slit. */
export const formatDegrees = (deg: number | null) => (deg === null ? '—' : deg.toFixed(5));

/** Redshifts to 5 decimals, the precision a reader works at (the comb moves in steps of 1e-5). */
export const formatRedshift = (z: number | null) => (z === null ? '—' : z.toFixed(5));

/** A count with thin-space thousands separators, so 12 345 spectra read at a glance. */
export const formatCount = (n: number) => String(n).replace(/\B(?=(\d{3})+(?!\d))/g, '\u2009');

/** A redshift uncertainty at the same precision; below it, say so rather than print ± 0.00000. */
export const formatRedshiftError = (dz: number) => (dz < 0.000005 ? '< 0.00001' : dz.toFixed(5));
