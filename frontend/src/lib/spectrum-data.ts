import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiErrorFromBody, ApiError, NETWORK_ERROR_MESSAGE } from './api-client';
import { decodeSpectrumData } from './decode-spectrum-data';
import type { SpectrumArrays } from './decode-spectrum-data';

/** Shared by every page that plots a spectrum (inspection, settlement), so they share one cache entry. */
export const spectrumDataKey = (spectrumId: number) => ['spectrum-data', spectrumId] as const;

/** Binary answers (packed arrays) do not go through api.get; errors still arrive as ApiError. */
export async function fetchBinary<T>(url: string, decode: (buffer: ArrayBuffer) => T, what: string, signal?: AbortSignal): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, { credentials: 'same-origin', headers: { Accept: 'application/octet-stream' }, signal: signal ?? null });
  } catch (e) {
    if (e instanceof DOMException && e.name === 'AbortError') throw e;
    throw new ApiError(0, 'network_error', NETWORK_ERROR_MESSAGE);
  }
  if (!res.ok) throw apiErrorFromBody(res.status, res.statusText, await res.json().catch(() => null));
  try {
    return decode(await res.arrayBuffer());
  } catch (e) {
    throw new ApiError(res.status, 'unexpected_response', `${what} could not be decoded: ${e instanceof Error ? e.message : String(e)}`);
  }
}

export const getSpectrumData = (spectrumId: number, signal?: AbortSignal): Promise<SpectrumArrays> =>
  fetchBinary(`/api/spectra/${spectrumId}/data`, decodeSpectrumData, "The spectrum's arrays", signal);

export const getSpectrumDataQueryOptions = (spectrumId: number) =>
  queryOptions({
    queryKey: spectrumDataKey(spectrumId),
    queryFn: ({ signal }) => getSpectrumData(spectrumId, signal),
    // The arrays of a stored file never change; refetching would only rebuild the plot.
    staleTime: Infinity,
  });

export const useSpectrumData = (spectrumId: number) => useQuery(getSpectrumDataQueryOptions(spectrumId));
