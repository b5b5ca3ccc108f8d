import { and, asc, eq, inArray } from 'drizzle-orm';
import { gridStepOf, type CampaignRole } from '../contracts/campaigns';
import type { Reading } from '../contracts/readings';
import type { Scan, SpectrumDetail } from '../contracts/spectra';
import { assignments, campaigns, readings, scanResults, spectra, targets, users } from '../db/schema';
import { unpackCurves } from '../jobs/scan-curves';
import type { Actor, ServiceContext } from './context';
import { fitsOf, photoZSummaryOf } from './photo-z-fits';
import { toReadingView } from './submit-reading';

/**
 * Everything the inspection screen shows about one spectrum except the arrays. Readings are
 * blind: a reader sees only their own (also on the other images of the family); a lead sees all;
 * an observer none until confirmed.
 */
export function getSpectrumDetail(ctx: ServiceContext, actor: Actor, role: CampaignRole | null, spectrumId: number): SpectrumDetail {
  const s = ctx.db.select().from(spectra).where(eq(spectra.id, spectrumId)).get()!;
  const campaign = ctx.db.select().from(campaigns).where(eq(campaigns.id, s.campaignId)).get()!;
  const target = s.targetId === null ? null : (ctx.db.select().from(targets).where(eq(targets.id, s.targetId)).get() ?? null);
  const scan = ctx.db.select().from(scanResults).where(and(eq(scanResults.spectrumId, s.id), eq(scanResults.isCurrent, true))).get();
  const assignment = ctx.db.select().from(assignments).where(and(eq(assignments.spectrumId, s.id), eq(assignments.readerId, actor.id))).get();

  const visibleReadings = (spectrumIds: number[]): Reading[] => {
    if (spectrumIds.length === 0 || (role !== 'lead' && role !== 'reader')) return [];
    const rows = ctx.db
      .select({ reading: readings, readerName: users.name })
      .from(readings)
      .innerJoin(users, eq(users.id, readings.readerId))
      .where(and(inArray(readings.spectrumId, spectrumIds), role === 'lead' ? undefined : eq(readings.readerId, actor.id)))
      .orderBy(asc(readings.readingOrder))
      .all();
    return rows.map((r) => toReadingView(r.reading, r.readerName));
  };

  const family = target?.imageFamily
    ? ctx.db
        .select({ spectrumId: spectra.id, targetId: targets.id, catalogueId: targets.catalogueId, zBest: scanResults.zBest })
        .from(targets)
        .innerJoin(spectra, eq(spectra.targetId, targets.id))
        .leftJoin(scanResults, and(eq(scanResults.spectrumId, spectra.id), eq(scanResults.isCurrent, true)))
        .where(and(eq(targets.campaignId, s.campaignId), eq(targets.imageFamily, target.imageFamily)))
        .orderBy(asc(targets.catalogueId))
        .all()
        .filter((m) => m.spectrumId !== s.id)
    : [];
  const familyReadings = visibleReadings(family.map((m) => m.spectrumId));

  return {
    spectrum: {
      id: s.id,
      campaignId: s.campaignId,
      fileName: s.fileName,
      objectName: s.objectName,
      ra: s.ra,
      dec: s.dec,
      instrument: s.instrument,
      exposureS: s.exposureS,
      dateObs: s.dateObs,
      fluxUnit: s.fluxUnit,
      medium: s.medium,
      pixels: s.pixels,
      wavelengthMin: s.wavelengthMin,
      wavelengthMax: s.wavelengthMax,
      snrMedian: s.snrMedian,
      errorsEstimated: s.errorsEstimated,
      warnings: s.warnings,
    },
    campaign: {
      id: campaign.id,
      name: campaign.name,
      zMin: campaign.zMin,
      zMax: campaign.zMax,
      tolerance: campaign.tolerance,
      gridStep: campaign.gridStep,
      gradeScheme: campaign.gradeScheme,
      myRole: role,
    },
    target: target && {
      id: target.id,
      catalogueId: target.catalogueId,
      ra: target.ra,
      dec: target.dec,
      magnitude: target.magnitude,
      photoZ: target.photoZ,
      photoZLow: target.photoZLow,
      photoZHigh: target.photoZHigh,
      imageFamily: target.imageFamily,
      priority: target.priority,
      photoZFit: photoZFitOf(ctx, target.id),
    },
    family: family.map((m) => ({ ...m, readings: familyReadings.filter((r) => r.spectrumId === m.spectrumId) })),
    scan: scan
      ? {
          id: scan.id,
          engineVersion: scan.engineVersion,
          settings: { ...scan.settings, gridStep: gridStepOf(scan.settings) },
          class: scan.spectrumClass,
          ...unknownReasonOf(scan.meta),
          // JSON columns come back untyped; they hold what the scan stored (typed by its result).
          solutions: scan.solutions as Scan['solutions'],
          lineMatches: scan.lineMatches as Scan['lineMatches'],
          meta: withoutUnknownReason(scan.meta) as Scan['meta'],
          createdAt: scan.createdAt,
        }
      : null,
    assignment: assignment ? { readingOrder: assignment.readingOrder } : null,
    readings: visibleReadings([s.id]),
  };
}

/** The current scan's χ²(z) curves as plain arrays (rounded; they are for plotting). */
export function getScanCurves(ctx: ServiceContext, spectrumId: number) {
  const scan = ctx.db.select({ curves: scanResults.curves }).from(scanResults).where(and(eq(scanResults.spectrumId, spectrumId), eq(scanResults.isCurrent, true))).get();
  if (!scan) return { curves: [] };
  return {
    curves: unpackCurves(scan.curves).map((c) => ({
      template: c.template,
      class: c.class,
      z: Array.from(c.z, (v) => Number(v.toFixed(6))),
      chi2: Array.from(c.chi2, (v) => Number(v.toPrecision(7))),
    })),
  };
}

/** The engine's reason for an 'unknown' class, kept in the scan's meta (engine ≥ 0.6.0). */
function unknownReasonOf(meta: unknown): { unknownReason?: string } {
  const reason = (meta as { unknownReason?: unknown } | null)?.unknownReason;
  return typeof reason === 'string' ? { unknownReason: reason } : {};
}

/** The scan's meta as the contract declares it: the reason for 'unknown' is served beside the class. */
function withoutUnknownReason(meta: unknown): unknown {
  if (meta === null || typeof meta !== 'object' || !('unknownReason' in meta)) return meta;
  const { unknownReason: _reason, ...rest } = meta as Record<string, unknown>;
  return rest;
}

function photoZFitOf(ctx: ServiceContext, targetId: number) {
  const fit = fitsOf(ctx.db, [targetId]).get(targetId);
  return fit ? photoZSummaryOf(fit) : null;
}
