import type { ConfirmedRow, UnconfirmedMember } from './types';

/** One image of a family with its confirmed redshift. */
export interface FamilyMember {
  targetId: string | null;
  spectrumId: number;
  recordId: number;
  z: number;
  gradeCode: string;
  gradeLabel: string;
}

/** The consistency check of one image family. */
export interface FamilyCheck {
  family: string;
  members: FamilyMember[];
  /** Images of the family that have no confirmed redshift yet. */
  unconfirmed: UnconfirmedMember[];
  /** Mean of the members' confirmed z; null when no member is confirmed. */
  meanZ: number | null;
  /** (max z − min z)/(1 + mean z) over confirmed members: the largest pairwise |Δz|/(1+z̄); 0 for one member. */
  spread: number | null;
  /** Members disagree by more than the campaign tolerance. */
  discrepant: boolean;
  /** Some image has no confirmed redshift, so the family cannot be declared consistent. */
  incomplete: boolean;
  flagged: boolean;
}

/**
 * Per image family: its confirmed members, the spread of their redshifts in |Δz|/(1+z̄), and flags
 * when they disagree beyond `tolerance` or an image is still unconfirmed. A record that another
 * record in `rows` supersedes is history, not a member. Families are sorted by name.
 *
 * @param tolerance the campaign's agreement tolerance on |Δz|/(1+z)
 * @param unconfirmed family images without a confirmed record
 */
export function familyTable(rows: readonly ConfirmedRow[], tolerance: number, unconfirmed: readonly UnconfirmedMember[] = []): FamilyCheck[] {
  if (!(tolerance >= 0) || !Number.isFinite(tolerance)) throw new RangeError(`The agreement tolerance must be a finite number ≥ 0, got ${tolerance}.`);
  const superseded = new Set(rows.map((r) => r.supersedes).filter((id): id is number => id !== null));
  const families = new Map<string, { members: FamilyMember[]; unconfirmed: UnconfirmedMember[] }>();
  const entry = (name: string) => {
    let f = families.get(name);
    if (!f) families.set(name, (f = { members: [], unconfirmed: [] }));
    return f;
  };
  for (const r of rows) {
    if (r.imageFamily === null || r.imageFamily === '' || superseded.has(r.id)) continue;
    if (!Number.isFinite(r.z)) throw new RangeError(`Confirmed record ${r.id}: z must be a finite number, got ${r.z}.`);
    entry(r.imageFamily).members.push({
      targetId: r.targetId,
      spectrumId: r.spectrumId,
      recordId: r.id,
      z: r.z,
      gradeCode: r.gradeCode,
      gradeLabel: r.gradeLabel,
    });
  }
  for (const u of unconfirmed) if (u.imageFamily !== '') entry(u.imageFamily).unconfirmed.push(u);

  return [...families.entries()]
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
    .map(([family, f]) => {
      const zs = f.members.map((m) => m.z);
      const meanZ = zs.length ? zs.reduce((s, z) => s + z, 0) / zs.length : null;
      const spread = meanZ === null ? null : (Math.max(...zs) - Math.min(...zs)) / (1 + meanZ);
      const discrepant = spread !== null && spread > tolerance;
      const incomplete = f.unconfirmed.length > 0;
      return { family, members: f.members, unconfirmed: f.unconfirmed, meanZ, spread, discrepant, incomplete, flagged: discrepant || incomplete };
    });
}
