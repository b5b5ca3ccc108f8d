import { and, eq, inArray, isNull, sql } from 'drizzle-orm';
import { columnMappingSchema, type CatalogueImportResult, type ColumnMapping } from '../contracts/targets';
import { preparedQuery } from '../db/prepared';
import { catalogueMappings, spectra, targetPhotometry, targets } from '../db/schema';
import { AppError } from '../http/errors';
import { linkTarget } from '../ingest/link-target';
import { guessMapping, parseCatalogueText, readCatalogueRows } from '../ingest/read-catalogue';
import type { Actor, ServiceContext } from './context';
import { knownFilterNames } from './photo-z-filters';
import { queuePhotoZJob } from '../jobs/photoz-job';
import { deletePhotoZFits, refitPhotoZ } from './photo-z-fits';
import { recordAudit } from './record-audit';

/**
 * One band of one target, prepared once: a catalogue of 10^5 sources in ten bands is 10^6 rows, and
 * building them as multi-row inserts cost most of a large import's time in the query builder.
 */
const insertBand = preparedQuery((db) =>
  db
    .insert(targetPhotometry)
    .values({
      targetId: sql.placeholder('targetId'),
      filter: sql.placeholder('filter'),
      fluxNjy: sql.placeholder('fluxNjy'),
      errNjy: sql.placeholder('errNjy'),
      givenValue: sql.placeholder('givenValue'),
      givenError: sql.placeholder('givenError'),
      unit: sql.placeholder('unit'),
    })
    .prepare(),
);

/**
 * One target upserted by campaign and catalogue id, prepared once (as insertBand); placeholders
 * bound in column places go through the column's own mapping (`extra` as JSON).
 */
const upsertTarget = preparedQuery((db) =>
  db
    .insert(targets)
    .values({
      campaignId: sql.placeholder('campaignId'),
      catalogueId: sql.placeholder('catalogueId'),
      ra: sql.placeholder('ra'),
      dec: sql.placeholder('dec'),
      magnitude: sql.placeholder('magnitude'),
      photoZ: sql.placeholder('photoZ'),
      photoZLow: sql.placeholder('photoZLow'),
      photoZHigh: sql.placeholder('photoZHigh'),
      imageFamily: sql.placeholder('imageFamily'),
      priority: sql.placeholder('priority'),
      extra: sql.placeholder('extra'),
      updatedAt: sql.placeholder('updatedAt'),
    })
    .onConflictDoUpdate({
      target: [targets.campaignId, targets.catalogueId],
      set: {
        ra: sql`excluded.ra`,
        dec: sql`excluded.dec`,
        magnitude: sql`excluded.magnitude`,
        photoZ: sql`excluded.photo_z`,
        photoZLow: sql`excluded.photo_z_low`,
        photoZHigh: sql`excluded.photo_z_high`,
        imageFamily: sql`excluded.image_family`,
        priority: sql`excluded.priority`,
        extra: sql`excluded.extra`,
        updatedAt: sql`excluded.updated_at`,
      },
    })
    .prepare(),
);

/** The campaign's remembered mapping, when every column it names is in this catalogue. */
function rememberedMapping(ctx: ServiceContext, campaignId: number, columns: string[]): ColumnMapping | null {
  const row = ctx.db.select({ mapping: catalogueMappings.mapping }).from(catalogueMappings).where(eq(catalogueMappings.campaignId, campaignId)).get();
  const parsed = row ? columnMappingSchema.safeParse(row.mapping) : null;
  if (!parsed?.success) return null;
  const { bands = [], ...fields } = parsed.data;
  const named = [...Object.values(fields), ...bands.flatMap((b) => [b.flux, b.err])];
  return named.every((c) => columns.includes(c)) ? parsed.data : null;
}

/**
 * The remembered mapping, completed with what the guess finds in columns it does not use: a
 * catalogue that gains a photo-z or a band since the last import has them read, while every
 * choice the lead made before stays.
 */
function withNewColumns(remembered: ColumnMapping, guessed: ColumnMapping | null): ColumnMapping {
  if (!guessed) return remembered;
  const { bands = [], ...fields } = remembered;
  const taken = new Set([...Object.values(fields), ...bands.flatMap((b) => [b.flux, b.err])]);
  const out: ColumnMapping = { ...remembered, bands: [...bands] };
  const { bands: guessedBands = [], ...guessedFields } = guessed;
  for (const [key, column] of Object.entries(guessedFields) as Array<[keyof typeof guessedFields, string]>) {
    if (out[key] === undefined && !taken.has(column)) (out as Record<string, unknown>)[key] = column;
  }
  for (const b of guessedBands) if (!bands.some((x) => x.filter === b.filter) && !taken.has(b.flux) && !taken.has(b.err)) out.bands!.push(b);
  return out;
}

/**
 * Imports a target catalogue. Without a mapping (or with `dryRun`) it only reports the columns,
 * the proposed mapping and the row errors, for the mapping step. With a valid mapping it
 * creates or updates targets by catalogue id — all rows or none — and links spectra that had no
 * target yet. Targets are updated in place, so readings on their spectra are untouched. Band
 * fluxes in the mapping replace those targets' photometry and their photometric redshifts are
 * computed in the same transaction; the mapping is remembered for the campaign's next import.
 * Above `config.photoZJobThreshold` rows with photometry, the fits are left to a photo-z job
 * queued in the same transaction (`photoZJobId`): the targets' old fits are removed with their
 * old photometry, so no fit ever disagrees with the stored fluxes.
 */
export function importCatalogue(
  ctx: ServiceContext,
  actor: Actor,
  campaignId: number,
  text: string,
  mapping: ColumnMapping | undefined,
  dryRun: boolean,
): CatalogueImportResult {
  const parsed = parseCatalogueText(text);
  if (parsed.columns.length === 0) {
    throw new AppError(400, 'catalogue_empty', 'The catalogue has no header line with column names.');
  }
  const known = knownFilterNames(ctx.db, campaignId);
  const guessed = guessMapping(parsed.columns, known);
  const remembered = rememberedMapping(ctx, campaignId, parsed.columns);
  const used = mapping ?? (remembered ? withNewColumns(remembered, guessed) : guessed);
  const base = { columns: parsed.columns, mapping: used, rows: parsed.records.length, created: 0, updated: 0, linked: 0, photoZFits: 0, photoZJobId: null };
  if (!used) {
    return { ...base, dryRun: true, errors: [{ line: 1, column: null, message: 'No column looks like a catalogue id; choose one.' }] };
  }
  const { targets: rows, errors } = readCatalogueRows(parsed, used, new Set(known));
  if (dryRun || errors.length > 0) return { ...base, dryRun: true, errors };

  const result = ctx.db.transaction((tx) => {
    const existing = new Set(
      tx.select({ id: targets.catalogueId }).from(targets).where(eq(targets.campaignId, campaignId)).all().map((r) => r.id),
    );
    const now = ctx.now().toISOString();
    const upsert = upsertTarget(ctx.db);
    for (const { photometry: _, ...row } of rows) upsert.run({ ...row, campaignId, updatedAt: now });
    const created = rows.filter((r) => !existing.has(r.catalogueId)).length;

    const all = tx.select({ id: targets.id, catalogueId: targets.catalogueId, ra: targets.ra, dec: targets.dec }).from(targets).where(eq(targets.campaignId, campaignId)).all();
    let photoZFits = 0;
    let photoZJobId: number | null = null;
    if ((used.bands ?? []).length > 0) {
      const idOf = new Map(all.map((t) => [t.catalogueId, t.id]));
      const ids = rows.map((r) => idOf.get(r.catalogueId)!);
      for (let i = 0; i < ids.length; i += 500) tx.delete(targetPhotometry).where(inArray(targetPhotometry.targetId, ids.slice(i, i + 500))).run();
      const insert = insertBand(ctx.db);
      rows.forEach((r, i) => {
        for (const b of r.photometry) insert.run({ ...b, targetId: ids[i]! });
      });
      const withBands = ids.filter((_, i) => rows[i]!.photometry.length > 0);
      if (withBands.length > ctx.config.photoZJobThreshold) {
        deletePhotoZFits(tx, ids);
        photoZJobId = queuePhotoZJob(tx, campaignId, actor.id, withBands);
      } else photoZFits = refitPhotoZ(tx, campaignId, ids, now);
    }
    tx.insert(catalogueMappings)
      .values({ campaignId, mapping: used, updatedAt: now })
      .onConflictDoUpdate({ target: catalogueMappings.campaignId, set: { mapping: used, updatedAt: now } })
      .run();
    const unlinked = tx
      .select({ id: spectra.id, fileName: spectra.fileName, objectName: spectra.objectName, ra: spectra.ra, dec: spectra.dec })
      .from(spectra)
      .where(and(eq(spectra.campaignId, campaignId), isNull(spectra.targetId)))
      .all();
    let linked = 0;
    for (const s of unlinked) {
      const link = linkTarget(all, { fileName: s.fileName, objectName: s.objectName ?? undefined, ra: s.ra ?? undefined, dec: s.dec ?? undefined }, ctx.config.linkToleranceArcsec);
      if (!link) continue;
      tx.update(spectra).set({ targetId: link.targetId, linkMethod: link.method }).where(eq(spectra.id, s.id)).run();
      linked += 1;
    }
    recordAudit(tx, {
      actorId: actor.id,
      action: 'targets.imported',
      subjectType: 'campaign',
      subjectId: campaignId,
      campaignId,
      after: { rows: rows.length, created, updated: rows.length - created, linked, photoZFits, photoZJobId, mapping: used },
    });
    return { ...base, dryRun: false, created, updated: rows.length - created, linked, photoZFits, photoZJobId, errors: [] };
  });
  if (result.photoZJobId !== null) ctx.wakeJobRunner();
  return result;
}
