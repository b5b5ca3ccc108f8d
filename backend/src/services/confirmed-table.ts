import { and, asc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { z } from 'zod';
import type { ConfirmedPage, confirmedQuerySchema } from '../contracts/release';
import { qualified } from '../db/qualified';
import { campaigns, confirmedRedshifts, disagreements, photoZFits, readings, scanResults, spectra, targets, users } from '../db/schema';
import type { Solution } from '../contracts/spectra';
import type { ConfirmedRow, ExportAssumptions } from '../exports';
import { campaignPhotoZProvenance, fitsOf, posteriorOf } from './photo-z-fits';
import { PHOTOZ_PRIOR_NOTE, photoZPriorSource } from './solution-prior';
import { PLANCK18 } from '../spectra/flatLcdm';
import { ENGINE_VERSION } from '../spectra/version';
import type { StoredLineMeasurements } from '../contracts/line-measurements';
import type { ServiceContext } from './context';

type Query = z.output<typeof confirmedQuerySchema>;
type Filters = Partial<Pick<Query, 'grade' | 'class' | 'family' | 'confirmedBy'>>;

export const EXPORT_COSMOLOGY = { name: 'Planck 2018 (A&A 641, A6) abstract values, flat ΛCDM without radiation', h0: PLANCK18.h0, omegaM: PLANCK18.omegaM, omegaLambda: 1 - PLANCK18.omegaM, flat: true as const };

function filtersFor(campaignId: number, query: Filters): SQL {
  const f: SQL[] = [eq(spectra.campaignId, campaignId), eq(confirmedRedshifts.isCurrent, true)];
  if (query.grade !== undefined) f.push(eq(confirmedRedshifts.grade, query.grade));
  if (query.class) f.push(eq(confirmedRedshifts.spectrumClass, query.class));
  if (query.family) f.push(eq(targets.imageFamily, query.family));
  if (query.confirmedBy) f.push(eq(confirmedRedshifts.method, query.confirmedBy));
  return and(...f)!;
}

/** The current confirmed redshifts of a campaign as export rows, in target order. */
export function confirmedRows(ctx: ServiceContext, campaignId: number, query: Filters, page?: { limit: number; offset: number }): { rows: ConfirmedRow[]; total: number } {
  const campaign = ctx.db.select({ gradeScheme: campaigns.gradeScheme }).from(campaigns).where(eq(campaigns.id, campaignId)).get()!;
  const where = filtersFor(campaignId, query);
  const base = ctx.db
    .select({ c: confirmedRedshifts, s: { id: spectra.id, fileName: spectra.fileName, ra: spectra.ra, dec: spectra.dec }, t: targets })
    .from(confirmedRedshifts)
    .innerJoin(spectra, eq(spectra.id, confirmedRedshifts.spectrumId))
    .leftJoin(targets, eq(targets.id, spectra.targetId))
    .where(where)
    .orderBy(asc(targets.catalogueId), asc(spectra.fileName));
  const found = page ? base.limit(page.limit).offset(page.offset).all() : base.all();
  const total = ctx.db
    .select({ n: sql<number>`count(*)` })
    .from(confirmedRedshifts)
    .innerJoin(spectra, eq(spectra.id, confirmedRedshifts.spectrumId))
    .leftJoin(targets, eq(targets.id, spectra.targetId))
    .where(where)
    .get()!.n;
  const readingIds = found.flatMap((r) => [r.c.firstReadingId, r.c.secondReadingId]).filter((id): id is number => id !== null);
  const readerNames = new Map(
    readingIds.length
      ? ctx.db.select({ id: readings.id, name: users.name }).from(readings).innerJoin(users, eq(users.id, readings.readerId)).where(inArray(readings.id, readingIds)).all().map((r) => [r.id, r.name])
      : [],
  );
  const label = new Map(campaign.gradeScheme.map((g) => [g.code, g.label]));
  const spectrumIds = found.map((r) => r.s.id);
  const solutionsOf = new Map(
    spectrumIds.length
      ? ctx.db
          .select({ spectrumId: scanResults.spectrumId, solutions: scanResults.solutions })
          .from(scanResults)
          .where(and(inArray(scanResults.spectrumId, spectrumIds), eq(scanResults.isCurrent, true)))
          .all()
          .map((r) => [r.spectrumId, r.solutions as Solution[]])
      : [],
  );
  const fits = fitsOf(ctx.db, found.flatMap(({ t }) => (t ? [t.id] : [])));
  return {
    total,
    rows: found.map(({ c, s, t }) => ({
      id: c.id,
      spectrumId: s.id,
      fileName: s.fileName,
      targetId: t?.catalogueId ?? null,
      // Catalogue positions are the reference; the spectrum's own header is the fallback.
      ra: t?.ra ?? s.ra,
      dec: t?.dec ?? s.dec,
      z: c.z,
      zErr: c.zErr,
      gradeCode: c.grade,
      gradeLabel: label.get(c.grade) ?? `grade ${c.grade}`,
      spectrumClass: c.spectrumClass,
      lines: c.lines,
      ...lineColumns(c.lineMeasurements ?? null),
      photoZ: t?.photoZ ?? null,
      photoZLow: t?.photoZLow ?? null,
      photoZHigh: t?.photoZHigh ?? null,
      imageFamily: t?.imageFamily ?? null,
      readers: [c.firstReadingId, c.secondReadingId].map((id) => (id === null ? undefined : readerNames.get(id))).filter((n): n is string => n !== undefined),
      confirmedBy: c.method,
      confirmedAt: c.createdAt,
      supersedes: c.supersedesId,
      ...interloperColumns(c.spectrumClass, c.z, solutionsOf.get(s.id) ?? []),
      ...computedPhotoZ(t ? fits.get(t.id) : undefined),
    })),
  };
}

/** A confirmed record's stored line measurements as the export carries them: the deciding quantity with its error. */
function lineColumns(stored: StoredLineMeasurements | null): Pick<ConfirmedRow, 'lineMeasurements' | 'lineFluxUnit' | 'zErrFloor'> {
  if (!stored) return { lineMeasurements: [], lineFluxUnit: null, zErrFloor: null };
  return {
    lineMeasurements: stored.lines.map((m) => {
      const [value, error] = m.measure === 'flux' ? [m.flux, m.fluxErr] : m.measure === 'ew' ? [m.ewRest, m.ewRestErr] : [m.breakRatio, m.breakRatioErr];
      return { name: m.name, measure: m.measure, value, error, snr: m.snr, offsetKms: m.offsetKms, detected: m.detected, blendedWith: m.blendedWith };
    }),
    lineFluxUnit: stored.fluxUnit,
    zErrFloor: stored.zErrFloor,
  };
}

/** The computed photo-z columns of a target's fit (null without photometry). */
function computedPhotoZ(fit: typeof photoZFits.$inferSelect | undefined): Pick<ConfirmedRow, 'zPhot' | 'zPhotLow' | 'zPhotHigh' | 'zPhotPLowZ'> {
  if (!fit) return { zPhot: null, zPhotLow: null, zPhotHigh: null, zPhotPLowZ: null };
  const r4 = (v: number) => Number(v.toFixed(4));
  return { zPhot: r4(fit.z), zPhotLow: r4(fit.z68Low), zPhotHigh: r4(fit.z68High), zPhotPLowZ: r4(fit.pLowZ) };
}

/** Tolerance in |Δz|/(1 + z) within which a scanned Lyman-break solution is the confirmed value's. */
const INTERLOPER_MATCH = 0.01;

/** The interloper check of the scanned Lyman-break solution at a confirmed z (assumptions: INTERLOPER_NOTE). */
function interloperColumns(spectrumClass: string, z: number, solutions: Solution[]): Pick<ConfirmedRow, 'interloperZ' | 'interloperDeltaChi2' | 'starDeltaChi2'> {
  const none = { interloperZ: null, interloperDeltaChi2: null, starDeltaChi2: null };
  if (spectrumClass !== 'lyman-break') return none;
  const match = solutions.find((s) => s.class === 'lyman-break' && s.interlopers && Math.abs(s.z - z) / (1 + z) <= INTERLOPER_MATCH);
  if (!match?.interlopers) return none;
  const mirror = match.interlopers.find((a) => a.kind === '4000-break');
  const stars = match.interlopers.filter((a) => a.kind !== '4000-break').map((a) => a.deltaChi2);
  return { interloperZ: mirror?.z ?? null, interloperDeltaChi2: mirror?.deltaChi2 ?? null, starDeltaChi2: stars.length ? Math.min(...stars) : null };
}

/** How many spectra are unread, have one reading, agreed, disagree, or were settled. */
export function spectrumStates(ctx: ServiceContext, campaignId: number): ConfirmedPage['states'] {
  const rows = ctx.db
    .select({
      readings: sql<number>`(select count(*) from ${readings} where ${qualified(readings.spectrumId)} = ${qualified(spectra.id)})`,
      method: sql<string | null>`(select ${qualified(confirmedRedshifts.method)} from ${confirmedRedshifts} where ${qualified(confirmedRedshifts.spectrumId)} = ${qualified(spectra.id)} and ${qualified(confirmedRedshifts.isCurrent)} = 1)`,
      open: sql<number>`(select count(*) from ${disagreements} where ${qualified(disagreements.spectrumId)} = ${qualified(spectra.id)} and ${qualified(disagreements.state)} = 'open')`,
    })
    .from(spectra)
    .where(eq(spectra.campaignId, campaignId))
    .all();
  const states = { unread: 0, 'one reading': 0, agreed: 0, disagreement: 0, settled: 0 };
  for (const r of rows) {
    if (r.method === 'agreement') states.agreed += 1;
    else if (r.method) states.settled += 1;
    else if (r.open > 0) states.disagreement += 1;
    else if (r.readings >= 1) states['one reading'] += 1;
    else states.unread += 1;
  }
  return states;
}

export function exportAssumptions(ctx: ServiceContext, campaignId: number): ExportAssumptions {
  const c = ctx.db.select().from(campaigns).where(eq(campaigns.id, campaignId)).get()!;
  return {
    campaign: c.name,
    wavelengths: 'vacuum',
    cosmology: EXPORT_COSMOLOGY,
    tolerance: c.tolerance,
    gradeScheme: c.gradeScheme,
    exportedAt: ctx.now().toISOString(),
    software: `Redward ${ctx.config.version} / ${ENGINE_VERSION}`,
    ...campaignPhotoZProvenance(ctx.db, campaignId),
    photoZPrior: { convention: PHOTOZ_PRIOR_NOTE, records: photoZPriorRecords(ctx, campaignId) },
  };
}

/**
 * How many current confirmed records have a target ranked by each photo-z prior, decided by the
 * same rule the spectrum detail applies (photoZPriorSource): typed, computed P(z) or none.
 */
function photoZPriorRecords(ctx: ServiceContext, campaignId: number): { typed: number; computed: number; none: number } {
  const found = ctx.db
    .select({ t: { id: targets.id, photoZ: targets.photoZ, photoZLow: targets.photoZLow, photoZHigh: targets.photoZHigh } })
    .from(confirmedRedshifts)
    .innerJoin(spectra, eq(spectra.id, confirmedRedshifts.spectrumId))
    .leftJoin(targets, eq(targets.id, spectra.targetId))
    .where(and(eq(spectra.campaignId, campaignId), eq(confirmedRedshifts.isCurrent, true)))
    .all();
  const fits = fitsOf(ctx.db, [...new Set(found.flatMap(({ t }) => (t ? [t.id] : [])))]);
  const counts = { typed: 0, computed: 0, none: 0 };
  for (const { t } of found) {
    const fit = t ? fits.get(t.id) : undefined;
    counts[photoZPriorSource(t, fit ? posteriorOf(fit) : null)] += 1;
  }
  return counts;
}

/** Image-family members that have a spectrum but no current confirmed redshift yet. */
export function unconfirmedFamilyMembers(ctx: ServiceContext, campaignId: number) {
  return ctx.db
    .select({
      imageFamily: targets.imageFamily,
      targetId: targets.catalogueId,
      spectrumId: spectra.id,
      openDisagreementId: sql<number | null>`(select ${qualified(disagreements.id)} from ${disagreements} where ${qualified(disagreements.spectrumId)} = ${qualified(spectra.id)} and ${qualified(disagreements.state)} = 'open')`,
    })
    .from(targets)
    .leftJoin(spectra, eq(spectra.targetId, targets.id))
    .where(
      and(
        eq(targets.campaignId, campaignId),
        sql`${targets.imageFamily} is not null`,
        sql`not exists (select 1 from ${confirmedRedshifts} where ${qualified(confirmedRedshifts.spectrumId)} = ${qualified(spectra.id)} and ${qualified(confirmedRedshifts.isCurrent)} = 1)`,
      ),
    )
    .all()
    .map((r) => ({ imageFamily: r.imageFamily!, targetId: r.targetId, spectrumId: r.spectrumId, openDisagreementId: r.openDisagreementId ?? null }));
}
