import { eq, sql } from 'drizzle-orm';
import { preparedQuery } from '../db/prepared';
import { spectra } from '../db/schema';
import { notFound } from '../http/errors';
import type { ServiceContext } from './context';

const campaignOfSpectrum = preparedQuery((db) =>
  db.select({ campaignId: spectra.campaignId }).from(spectra).where(eq(spectra.id, sql.placeholder('spectrumId'))).prepare(),
);

/** The campaign a spectrum belongs to, for access checks; 404 when there is no such spectrum. */
export function spectrumCampaignId(ctx: ServiceContext, spectrumId: number): number {
  const row = Number.isSafeInteger(spectrumId) ? campaignOfSpectrum(ctx.db).get({ spectrumId }) : undefined;
  if (!row) throw notFound('No such spectrum.', 'spectrum_not_found');
  return row.campaignId;
}
