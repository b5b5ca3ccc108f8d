import { jobProgressSchema } from '@contracts/ingest';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import { isJobFinished } from '../api/get-job';
import { jobKeys } from '../api/keys';

/**
 * Follows a job over server-sent events while `enabled`, writing each progress message into
 * the job's query cache. `onStreamError` lets the caller fall back to polling.
 */
export function useJobEvents(jobId: number, enabled: boolean, onStreamError: () => void): void {
  const queryClient = useQueryClient();
  const onError = useRef(onStreamError);
  useEffect(() => {
    onError.current = onStreamError;
  });

  useEffect(() => {
    if (!enabled) return;
    const source = new EventSource(`/api/jobs/${jobId}/events`);
    source.addEventListener('progress', (e) => {
      let json: unknown;
      try {
        json = JSON.parse((e as MessageEvent<string>).data);
      } catch {
        return;
      }
      const parsed = jobProgressSchema.safeParse(json);
      if (!parsed.success) return;
      queryClient.setQueryData(jobKeys.detail(jobId), parsed.data);
      // The server ends the stream after a terminal state; closing first stops EventSource reconnecting.
      if (isJobFinished(parsed.data.state)) source.close();
    });
    source.onerror = () => {
      source.close();
      onError.current();
    };
    return () => source.close();
  }, [jobId, enabled, queryClient]);
}
