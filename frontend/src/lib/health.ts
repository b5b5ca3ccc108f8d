import { healthResponseSchema } from '@contracts/admin';
import { queryOptions } from '@tanstack/react-query';
import { api } from './api-client';

export const healthKeys = { all: () => ['health'] as const };

export const getHealth = (signal?: AbortSignal) => api.get('/api/health', healthResponseSchema, signal);

/** Which server version answers; quoted in bug reports and in the footer. */
export const getHealthQueryOptions = () =>
  queryOptions({ queryKey: healthKeys.all(), queryFn: ({ signal }) => getHealth(signal), staleTime: Infinity });
