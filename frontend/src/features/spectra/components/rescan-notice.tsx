import { Link } from 'react-router-dom';
import { Button, buttonClass } from '@/components/ui/button';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { formatCount, formatGridStep } from '@/lib/format';
import { useQueueRescan, useScanStatus } from '../api/scan-status';

/**
 * Offers a re-scan when scans no longer match the campaign: its redshift range or scan grid
 * changed, or the engine did. Earlier results are kept; the new ones become current.
 */
export function RescanNotice({ campaignId, isLead }: { campaignId: number; isLead: boolean }) {
  const status = useScanStatus(campaignId);
  const rescan = useQueueRescan(campaignId);
  if (!status.data || status.data.stale === 0) return null;
  const s = status.data;
  const n = formatCount(s.stale);
  return (
    <Notice tone="warning" role="status" title="Scans out of date">
      <p>
        <span className="num">{n}</span> of <span className="num">{formatCount(s.spectra)}</span> spectra were scanned with another
        redshift range, scan grid or engine version than the campaign now uses (<span className="num">{s.zMin} ≤ z ≤ {s.zMax}</span>,{' '}
        {formatGridStep(s.gridStep)}, {s.engineVersion}).
      </p>
      {isLead ? (
        <div className="mt-2 flex flex-wrap items-center gap-2">
          {rescan.data ? (
            <Link to={`/campaigns/${campaignId}/upload?job=${rescan.data.jobId}`} className={buttonClass('secondary', 'sm')}>
              Follow the re-scan of {formatCount(rescan.data.spectra)} spectra
            </Link>
          ) : (
            <Button size="sm" pending={rescan.isPending} pendingLabel="Queueing…" onClick={() => rescan.mutate()}>
              Re-scan {n} spectra
            </Button>
          )}
        </div>
      ) : null}
      {rescan.isError ? <ErrorNotice error={rescan.error} /> : null}
    </Notice>
  );
}
