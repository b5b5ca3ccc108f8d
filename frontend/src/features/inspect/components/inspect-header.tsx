import { Link } from 'react-router-dom';
import { Notice } from '@/components/ui/notice';
import { formatRedshift } from '@/lib/format';
import type { SpectrumDetail } from '../api/schemas';
import type { SavedFlash } from '../hooks/use-saved-flash';
import { CLASS_NAMES } from '@/lib/spectrum-class';

/** Page heading of the inspection screen: campaign, target or file, and the reading just saved. */
export function InspectHeader({ detail, campaign, flash }: { detail: SpectrumDetail | undefined; campaign: { id: number; name: string } | null; flash: SavedFlash['saved'] | null }) {
  const title = detail ? (detail.target?.catalogueId ?? detail.spectrum.fileName) : 'Inspect';
  return (
    <header className="flex flex-col gap-2 border-b border-paper-300 pb-2">
      <title>{`${title} · Inspect · Redward`}</title>
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <div className="min-w-0">
          <div className="text-sm text-ink-500">
            <Link to="/campaigns" className="hover:underline">
              Campaigns
            </Link>
            {campaign ? (
              <>
                <span aria-hidden="true"> / </span>
                <Link to={`/campaigns/${campaign.id}`} className="hover:underline">
                  {campaign.name}
                </Link>
              </>
            ) : null}
          </div>
          <h1 className="text-xl font-semibold text-ink-950">
            <span className="num">{title}</span>
            {detail && detail.target ? <span className="ml-3 text-base font-normal text-ink-500">{detail.spectrum.fileName}</span> : null}
          </h1>
        </div>
        {detail?.assignment ? <span className="text-sm text-ink-600">You give the {detail.assignment.readingOrder} reading</span> : null}
      </div>
      {flash ? (
        <Notice tone="success" role="status">
          Saved {flash.fileName}: <span className="num">z = {formatRedshift(flash.reading.z)}</span>, grade {flash.gradeLabel}, {CLASS_NAMES[flash.reading.class]} — revision {flash.reading.revision}.
        </Notice>
      ) : null}
    </header>
  );
}
