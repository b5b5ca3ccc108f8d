/**
 * Display helpers for the trade's numbers. Values are shown as stored, never rounded
 * into something the lead did not set.
 */

export const formatRedshiftRange = (zMin: number, zMax: number) => `${zMin} ≤ z ≤ ${zMax}`;

export const formatTolerance = (tolerance: number) => `|Δz|/(1+z) ≤ ${tolerance}`;

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
