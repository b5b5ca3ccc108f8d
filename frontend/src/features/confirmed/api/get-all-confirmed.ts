import type { ConfirmedPage } from '@contracts/release';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { getConfirmed } from './get-confirmed';
import { confirmedKeys } from './keys';

const PAGE = 1000; // the server's largest page

/** Every released value of the campaign, for the pictures: page after page until the total is reached. */
export async function getAllConfirmed(campaignId: number, signal?: AbortSignal): Promise<ConfirmedPage['rows']> {
  const rows: ConfirmedPage['rows'] = [];
  for (let page = 1; ; page++) {
    const answer = await getConfirmed(campaignId, { page, pageSize: PAGE }, signal);
    rows.push(...answer.rows);
    if (answer.rows.length < PAGE || rows.length >= answer.total) return rows;
  }
}

export const getAllConfirmedQueryOptions = (campaignId: number) =>
  queryOptions({ queryKey: [...confirmedKeys.campaign(campaignId), 'all'], queryFn: ({ signal }) => getAllConfirmed(campaignId, signal) });

export const useAllConfirmed = (campaignId: number) => useQuery(getAllConfirmedQueryOptions(campaignId));
