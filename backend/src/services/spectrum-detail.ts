import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import { gridStepOf, type CampaignRole } from '../contracts/campaigns';
import type { Reading } from '../contracts/readings';
import type { Scan, SpectrumDetail } from '../contracts/spectra';
import { preparedQuery } from '../db/prepared';
import { assignments, campaigns, readings, scanResults, spectra, targets, users } from '../db/schema';
import type { Actor, ServiceContext } from './context';
import { fitsOf, photoZSummaryOf, posteriorOf } from './photo-z-fits';
import { photoZPriorOf } from './solution-prior';
import { toReadingView } from './submit-reading';

// The inspection screen asks for a detail on every spectrum it opens: its reads are prepared once.
const id = sql.placeholder('id');
const spectrumById = preparedQuery((db) => db.select().from(spectra).where(eq(spectra.id, id)).prepare());
const campaignById = preparedQuery((db) => db.select().from(campaigns).where(eq(campaigns.id, id)).prepare());
const targetById = preparedQuery((db) => db.select().from(targets).where(eq(targets.id, id)).prepare());
const currentScanOf = preparedQuery((db) =>
  db.select().from(scanResults).where(and(eq(scanResults.spectrumId, id), eq(scanResults.isCurrent, true))).prepare(),
);
const assignmentOf = preparedQuery((db) =>
  db.select().from(assignments).where(and(eq(assignments.spectrumId, id), eq(assignments.readerId, sql.placeholder('readerId')))).prepare(),
);

/**
 * Everything the inspection screen shows about one spectrum except the arrays. Readings are
 * blind: a reader sees only their own (also on the other images of the family); a lead sees all;
 * an observer none until confirmed.
 */
export function getSpectrumDetail(ctx: ServiceContext, actor: Actor, role: CampaignRole | null, spectrumId: number): SpectrumDetail {
  const s = spectrumById(ctx.db).get({ id: spectrumId })!;
  const campaign = campaignById(ctx.db).get({ id: s.campaignId })!;
  const target = s.targetId === null ? null : (targetById(ctx.db).get({ id: s.targetId }) ?? null);
  const scan = currentScanOf(ctx.db).get({ id: s.id });
  const assignment = assignmentOf(ctx.db).get({ id: s.id, readerId: actor.id });

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
          ...priorOf(ctx, target, scan.solutions as Scan['solutions']),
          lineMatches: scan.lineMatches as Scan['lineMatches'],
          meta: withoutUnknownReason(scan.meta) as Scan['meta'],
          createdAt: scan.createdAt,
        }
      : null,
    assignment: assignment ? { readingOrder: assignment.readingOrder } : null,
    readings: visibleReadings([s.id]),
  };
}

const currentCurvesOf = preparedQuery((db) =>
  db
    .select({ id: scanResults.id, curves: scanResults.curves })
    .from(scanResults)
    .where(and(eq(scanResults.spectrumId, id), eq(scanResults.isCurrent, true)))
    .prepare(),
);

/** An empty packing (no curves): a spectrum not scanned yet has an empty strip, not an error. */
const NO_CURVES = Buffer.from([2, 0, 0, 0, 0x5b, 0x5d, 0, 0]);

/**
 * The current scan's χ²(z) curves, packed as stored (contracts/scan-curves-binary.ts), with a
 * validator naming the scan: a re-scan makes a new scan row, so the ETag changes exactly when the
 * curves do.
 */
export function getScanCurves(ctx: ServiceContext, spectrumId: number): { packed: Buffer; etag: string } {
  const scan = currentCurvesOf(ctx.db).get({ id: spectrumId });
  if (!scan) return { packed: NO_CURVES, etag: '"no-scan"' };
  return { packed: Buffer.from(scan.curves.buffer, scan.curves.byteOffset, scan.curves.byteLength), etag: `"scan-${scan.id}"` };
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

function priorOf(ctx: ServiceContext, target: { id: number; photoZ: number | null; photoZLow: number | null; photoZHigh: number | null } | null, solutions: Scan['solutions']) {
  if (!target) return {};
  const fit = fitsOf(ctx.db, [target.id]).get(target.id);
  const prior = photoZPriorOf(solutions as Parameters<typeof photoZPriorOf>[0], target, fit ? posteriorOf(fit) : null);
  return prior ? { photoZPrior: prior } : {};
}
