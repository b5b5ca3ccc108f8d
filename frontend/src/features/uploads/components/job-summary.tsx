import type { JobProgress } from '@contracts/ingest';
import { Stats } from '@/components/ui/stats';
import { formatCount } from '@/lib/format';

/** What became of every file: the five numbers a lead checks before reading starts. */
export function JobSummary({ job }: { job: JobProgress }) {
  const s = job.summary;
  return (
    <Stats
      label="Upload summary"
      stats={[
        { term: 'Stored', value: formatCount(s.stored) },
        { term: 'Duplicates', value: formatCount(s.duplicates) },
        ...(s.rescanned > 0 ? [{ term: 'Re-scanned', value: formatCount(s.rescanned) }] : []),
        { term: 'Linked', value: formatCount(s.linked) },
        { term: 'Unlinked', value: formatCount(s.unlinked), attention: s.unlinked > 0 },
        { term: 'Failed', value: formatCount(s.failed), attention: s.failed > 0 },
      ]}
    />
  );
}
