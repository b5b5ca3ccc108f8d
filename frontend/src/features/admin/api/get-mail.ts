import { mailListResponseSchema } from '@contracts/admin';
import type { MailSummary } from '@contracts/admin';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { adminKeys } from './keys';

export async function getMail(signal?: AbortSignal): Promise<MailSummary[]> {
  const { messages } = await api.get('/api/admin/mail', mailListResponseSchema, signal);
  return messages;
}

export const getMailQueryOptions = () =>
  queryOptions({
    queryKey: adminKeys.mail(),
    queryFn: ({ signal }) => getMail(signal),
    // Mail is caught seconds after an action elsewhere; poll gently so it shows up without a reload.
    refetchInterval: 10_000,
  });

export const useMail = () => useQuery(getMailQueryOptions());
