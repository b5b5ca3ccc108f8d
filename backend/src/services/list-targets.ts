import { and, asc, count, eq, like } from 'drizzle-orm';
import type { Target } from '../contracts/targets';
import { spectra, targets } from '../db/schema';
import type { ServiceContext } from './context';
import { fitsOf, photoZSummaryOf } from './photo-z-fits';

/** A campaign's targets with how many spectra each has and their computed photo-z, optionally filtered by id. */
export function listTargets(ctx: ServiceContext, campaignId: number, q?: string): Target[] {
  const filter = q ? like(targets.catalogueId, `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`) : undefined;
  const counts = new Map(
    ctx.db
      .select({ targetId: spectra.targetId, n: count() })
      .from(spectra)
      .where(eq(spectra.campaignId, campaignId))
      .groupBy(spectra.targetId)
      .all()
      .map((r) => [r.targetId, r.n]),
  );
  const rows = ctx.db.select().from(targets).where(and(eq(targets.campaignId, campaignId), filter)).orderBy(asc(targets.catalogueId)).all();
  const fits = fitsOf(ctx.db, rows.map((t) => t.id));
  return rows.map((t) => {
    const fit = fits.get(t.id);
    return {
      id: t.id,
      catalogueId: t.catalogueId,
      ra: t.ra,
      dec: t.dec,
      magnitude: t.magnitude,
      photoZ: t.photoZ,
      photoZLow: t.photoZLow,
      photoZHigh: t.photoZHigh,
      imageFamily: t.imageFamily,
      priority: t.priority,
      extra: t.extra,
      spectrumCount: counts.get(t.id) ?? 0,
      photoZFit: fit ? photoZSummaryOf(fit) : null,
    };
  });
}
