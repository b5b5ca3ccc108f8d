export type PhotoZAgreement = 'inside' | 'outside' | 'unknown';

/** Whether a redshift lies inside the target's 68 % photometric range (the prior never hides a solution; it is only shown). */
export function photoZAgreement(z: number, low: number | null | undefined, high: number | null | undefined): PhotoZAgreement {
  if (low == null || high == null) return 'unknown';
  return z >= low && z <= high ? 'inside' : 'outside';
}
