import { and, eq } from 'drizzle-orm';
import { campaigns, confirmedRedshifts, photoZFits, readings, spectra, targets, users } from '../db/schema';
import { cohensKappa } from '../release/cohens-kappa';
import { compareReadings } from '../release/compare-readings';
import { PHOTO_Z_OUTLIER, photoZQuality } from '../release/photo-z-quality';
import type { ServiceContext } from './context';

const median = (v: number[]) => {
  if (v.length === 0) return null;
  const s = [...v].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
};

/**
 * The campaign's pictures, from real records: spectroscopic versus photometric redshift with
 * outliers, the grade distribution of confirmed redshifts, and how often reader pairs agree
 * (fraction agreeing by the campaign's own rule, Cohen's κ on grades, median reading time).
 */
export function campaignStatistics(ctx: ServiceContext, campaignId: number) {
  const campaign = ctx.db.select().from(campaigns).where(eq(campaigns.id, campaignId)).get()!;
  const confirmed = ctx.db
    .select({ spectrumId: spectra.id, targetId: targets.catalogueId, z: confirmedRedshifts.z, grade: confirmedRedshifts.grade, typedPhotoZ: targets.photoZ, computedPhotoZ: photoZFits.z })
    .from(confirmedRedshifts)
    .innerJoin(spectra, eq(spectra.id, confirmedRedshifts.spectrumId))
    .leftJoin(targets, eq(targets.id, spectra.targetId))
    .leftJoin(photoZFits, eq(photoZFits.targetId, targets.id))
    .where(and(eq(spectra.campaignId, campaignId), eq(confirmedRedshifts.isCurrent, true)))
    .all();

  // The photo-z computed from the catalogue fluxes where there is one, else the catalogue's typed value.
  const withPhotoZ = confirmed
    .map((c) => ({ ...c, photoZ: c.computedPhotoZ ?? c.typedPhotoZ, source: c.computedPhotoZ !== null ? ('computed' as const) : ('catalogue' as const) }))
    .filter((c) => c.photoZ !== null);
  const quality = photoZQuality(withPhotoZ.map((c) => ({ zSpec: c.z, zPhot: c.photoZ! })));
  const outlierSet = new Set(quality.outliers);

  const gradeDistribution = campaign.gradeScheme.map((g) => ({ code: g.code, label: g.label, count: confirmed.filter((c) => c.grade === g.code).length }));

  const all = ctx.db
    .select({ r: readings, name: users.name })
    .from(readings)
    .innerJoin(spectra, eq(spectra.id, readings.spectrumId))
    .innerJoin(users, eq(users.id, readings.readerId))
    .where(eq(spectra.campaignId, campaignId))
    .all();
  const bySpectrum = new Map<number, { first?: (typeof all)[number]; second?: (typeof all)[number] }>();
  for (const row of all) {
    const entry = bySpectrum.get(row.r.spectrumId) ?? {};
    entry[row.r.readingOrder] = row;
    bySpectrum.set(row.r.spectrumId, entry);
  }
  const pairs = new Map<string, { readers: [string, string]; grades: [string[], string[]]; agreed: number }>();
  for (const { first, second } of bySpectrum.values()) {
    if (!first || !second) continue;
    const [a, b] = first.r.readerId < second.r.readerId ? [first, second] : [second, first];
    const key = `${a.r.readerId}-${b.r.readerId}`;
    const pair = pairs.get(key) ?? { readers: [a.name, b.name] as [string, string], grades: [[], []] as [string[], string[]], agreed: 0 };
    pair.grades[0].push(a.r.grade);
    pair.grades[1].push(b.r.grade);
    if (compareReadings(a.r, b.r, campaign.gradeScheme, campaign.tolerance).agree) pair.agreed += 1;
    pairs.set(key, pair);
  }
  const readerNames = [...new Set(all.map((r) => r.name))].sort();

  return {
    photoZ: {
      threshold: PHOTO_Z_OUTLIER,
      n: quality.n,
      outlierFraction: quality.outlierFraction,
      sigmaNmad: quality.sigmaNmad,
      points: withPhotoZ.map((c, i) => ({ spectrumId: c.spectrumId, targetId: c.targetId, zSpec: c.z, zPhot: c.photoZ!, outlier: outlierSet.has(i), source: c.source })),
    },
    gradeDistribution,
    readerPairs: [...pairs.values()].map((p) => ({
      readers: p.readers,
      n: p.grades[0].length,
      agreeFraction: p.agreed / p.grades[0].length,
      kappaOnGrades: cohensKappa(p.grades[0], p.grades[1]),
    })),
    readingTime: readerNames.map((name) => ({ reader: name, readings: all.filter((r) => r.name === name).length, medianMs: median(all.filter((r) => r.name === name).map((r) => r.r.timeSpentMs)) })),
  };
}
