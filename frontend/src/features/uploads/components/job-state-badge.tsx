import type { JobState } from '@contracts/ingest';
import { Badge } from '@/components/ui/badge';

const TONE = { queued: 'ink', running: 'blue', done: 'success', failed: 'danger', cancelled: 'ember' } as const;

export function JobStateBadge({ state }: { state: JobState }) {
  return <Badge tone={TONE[state]}>{state}</Badge>;
}
