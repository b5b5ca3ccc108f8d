import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { and, asc, eq } from 'drizzle-orm';
import { FILTER_DIR, shippedFilterNames } from '../cli/photoz-data';
import type { FilterInfo } from '../contracts/targets';
import { campaignFilters } from '../db/schema';
import { AppError, conflict } from '../http/errors';
import { FilterCurveError, parseFilterCurve, type FilterCurve } from '../photoz/filterCurve';
import { effectiveWavelength } from '../photoz/photometry';
import type { Actor, ServiceContext } from './context';
import { recordAudit } from './record-audit';

type Reader = Pick<ServiceContext['db'], 'select'>;

let shipped: { names: string[]; curves: Map<string, FilterCurve>; wavelengthEff: Map<string, number> } | undefined;

/** The shipped curves, read once per process (they are part of the release, never edited at run time). */
function shippedFilters() {
  if (!shipped) {
    const names = [...shippedFilterNames()].sort();
    const curves = new Map(names.map((n) => [n, parseFilterCurve(readFileSync(join(FILTER_DIR, `${n}.par`), 'utf8'), n)]));
    shipped = { names, curves, wavelengthEff: new Map(names.map((n) => [n, effectiveWavelength(curves.get(n)!)])) };
  }
  return shipped;
}

function ownCurves(db: Reader, campaignId: number): FilterCurve[] {
  return db
    .select({ name: campaignFilters.name, text: campaignFilters.curveText })
    .from(campaignFilters)
    .where(eq(campaignFilters.campaignId, campaignId))
    .orderBy(asc(campaignFilters.name))
    .all()
    .map((r) => parseFilterCurve(r.text, r.name));
}

/** Filter names a campaign's catalogue may map bands to: shipped stems and its own curves. */
export function knownFilterNames(db: Reader, campaignId: number): string[] {
  return [...shippedFilters().names, ...ownCurves(db, campaignId).map((c) => c.name)];
}

/** The curves of the named filters, in the order given (unknown names throw: the import checked them). */
export function filterCurves(db: Reader, campaignId: number, names: readonly string[]): FilterCurve[] {
  const { curves } = shippedFilters();
  const own = new Map(ownCurves(db, campaignId).map((c) => [c.name, c]));
  return names.map((n) => {
    const c = curves.get(n) ?? own.get(n);
    if (!c) throw new RangeError(`unknown filter ${n}`);
    return c;
  });
}

export function listFilters(ctx: ServiceContext, campaignId: number): FilterInfo[] {
  const { names, wavelengthEff } = shippedFilters();
  return [
    ...names.map((name) => ({ name, source: 'shipped' as const, wavelengthEff: wavelengthEff.get(name)! })),
    ...ownCurves(ctx.db, campaignId).map((c) => ({ name: c.name, source: 'campaign' as const, wavelengthEff: effectiveWavelength(c) })),
  ];
}

/**
 * Adds a campaign's own filter curve (two columns: wavelength in Å, transmission). Refused with
 * the parser's sentence (naming the line) when the curve is not valid; a name already taken by a
 * shipped curve or an earlier curve of the campaign is a conflict (curves are never replaced, so
 * fits made with one stay explainable).
 */
export function addCampaignFilter(ctx: ServiceContext, actor: Actor, campaignId: number, name: string, text: string): FilterInfo {
  if (shippedFilters().curves.has(name)) throw conflict(`"${name}" is the name of a shipped filter; give your curve another name.`, 'filter_name_taken');
  let curve: FilterCurve;
  try {
    curve = parseFilterCurve(text, name);
  } catch (e) {
    if (e instanceof FilterCurveError) throw new AppError(400, 'filter_curve_invalid', e.message);
    throw e;
  }
  return ctx.db.transaction((tx) => {
    const taken = tx.select({ id: campaignFilters.id }).from(campaignFilters).where(and(eq(campaignFilters.campaignId, campaignId), eq(campaignFilters.name, name))).get();
    if (taken) throw conflict(`This campaign already has a filter curve named "${name}"; curves are kept as uploaded, so choose a new name.`, 'filter_name_taken');
    const row = tx.insert(campaignFilters).values({ campaignId, name, curveText: text, createdBy: actor.id }).returning({ id: campaignFilters.id }).get();
    const info = { name, source: 'campaign' as const, wavelengthEff: effectiveWavelength(curve) };
    recordAudit(tx, { actorId: actor.id, action: 'filter.added', subjectType: 'campaign_filter', subjectId: row.id, campaignId, after: { ...info, samples: curve.wavelength.length } });
    return info;
  });
}
