import { eq } from 'drizzle-orm';
import { spectra } from '../db/schema';
import { notFound } from '../http/errors';
import type { ServiceContext } from './context';

/** The campaign a spectrum belongs to, for access checks; 404 when there is no such spectrum. */
export function spectrumCampaignId(ctx: ServiceContext, spectrumId: number): number {
  const row = Number.isSafeInteger(spectrumId) ? ctx.db.select({ campaignId: spectra.campaignId }).from(spectra).where(eq(spectra.id, spectrumId)).get() : undefined;
  if (!row) throw notFound('No such spectrum.', 'spectrum_not_found');
  return row.campaignId;
}
