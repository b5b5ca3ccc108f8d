import { mailMessageResponseSchema } from '@contracts/admin';
import type { MailMessage } from '@contracts/admin';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { adminKeys } from './keys';

export async function getMailMessage(id: number, signal?: AbortSignal): Promise<MailMessage> {
  const { message } = await api.get(`/api/admin/mail/${id}`, mailMessageResponseSchema, signal);
  return message;
}

export const getMailMessageQueryOptions = (id: number) =>
  queryOptions({
    queryKey: adminKeys.mailMessage(id),
    queryFn: ({ signal }) => getMailMessage(id, signal),
    staleTime: Infinity, // a caught message never changes
  });

export const useMailMessage = (id: number) => useQuery(getMailMessageQueryOptions(id));
