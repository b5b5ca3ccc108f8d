import { Link } from 'react-router-dom';
import { Badge } from '@/components/ui/badge';
import { buttonClass } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { formatRedshift, formatTolerance } from '@/lib/format';
import { useFamilies } from '../api/get-families';
import type { FamilyCheck } from '../api/get-families';

/** Per lensed source: do its images' confirmed redshifts agree, and is every image confirmed? */
export function FamiliesView({ campaignId }: { campaignId: number }) {
  const families = useFamilies(campaignId);
  if (families.isPending) return <Loading label="Checking image families…" />;
  if (families.isError) return <ErrorNotice error={families.error} />;
  const { families: list, tolerance } = families.data;
  const flagged = list.filter((f) => f.flagged).length;

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p role="status" className="text-sm text-ink-700">
          <span className="num">{list.length}</span> {list.length === 1 ? 'family' : 'families'}, <span className="num">{flagged}</span> flagged. Members agree when their spread is{' '}
          <span className="num">{formatTolerance(tolerance)}</span>, the campaign's tolerance.
        </p>
        <a href={`/api/campaigns/${campaignId}/families?format=csv`} download className={buttonClass('secondary', 'sm')}>
          Download family table (CSV)
        </a>
      </div>
      {list.length === 0 ? (
        <EmptyState title="No image families">Families come from the catalogue's image-family column; none of this campaign's targets has one.</EmptyState>
      ) : (
        <ul className="grid grid-cols-1 gap-3 md:grid-cols-2">
          {list.map((f) => (
            <li key={f.family}>
              <FamilyCard family={f} campaignId={campaignId} />
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

function FamilyCard({ family: f, campaignId }: { family: FamilyCheck; campaignId: number }) {
  return (
    <section aria-label={`Image family ${f.family}`} className={`flex flex-col gap-2 rounded-panel border bg-paper-50 p-3 ${f.flagged ? 'border-warning-700/40' : 'border-paper-300'}`}>
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-md font-semibold text-ink-900">Family {f.family}</h2>
        <span className="flex flex-wrap gap-1">
          {f.discrepant ? <Badge tone="danger">members disagree beyond tolerance</Badge> : null}
          {f.incomplete ? <Badge tone="ember">member unconfirmed</Badge> : null}
          {!f.flagged ? <Badge tone="success">consistent</Badge> : null}
        </span>
      </header>
      <p className="num text-sm text-ink-700">
        mean z {f.meanZ === null ? '—' : formatRedshift(f.meanZ)} · spread Δz/(1+z) {f.spread === null ? '—' : f.spread.toExponential(2)}
      </p>
      <ul className="flex flex-col gap-0.5 text-sm">
        {f.members.map((m) => (
          <li key={m.recordId} className="flex flex-wrap items-baseline gap-2">
            <Link to={`/spectra/${m.spectrumId}`} className="num font-medium text-blueend-600 hover:underline">
              {m.targetId ?? `spectrum ${m.spectrumId}`}
            </Link>
            <span className="num">z = {formatRedshift(m.z)}</span>
            <span className="text-ink-500">grade {m.gradeCode === m.gradeLabel ? m.gradeLabel : `${m.gradeLabel} (${m.gradeCode})`}</span>
          </li>
        ))}
        {f.unconfirmed.map((u, i) => (
          <li key={`u${i}`} className="flex flex-wrap items-baseline gap-2 text-ink-500">
            {u.spectrumId !== null ? (
              <Link to={`/spectra/${u.spectrumId}`} className="num hover:underline">
                {u.targetId ?? `spectrum ${u.spectrumId}`}
              </Link>
            ) : (
              <span className="num">{u.targetId ?? 'unnamed image'}</span>
            )}
            {u.openDisagreementId ? (
              <Link to={`/campaigns/${campaignId}/disagreements?disagreement=${u.openDisagreementId}`} className="font-medium text-blueend-600 hover:underline">
                its readings disagree: settle it
              </Link>
            ) : (
              <span className="italic">{u.spectrumId === null ? 'no spectrum yet' : 'not confirmed yet'}</span>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
