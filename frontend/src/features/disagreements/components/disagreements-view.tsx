import type { Grade } from '@contracts/grades';
import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { useDisagreements } from '../api/get-disagreements';
import { useSettleDisagreement } from '../api/settle-disagreement';
import { DisagreementDetail } from './disagreement-detail';
import { DisagreementList } from './disagreement-list';
import type { ThirdReader } from './third-reader-form';

interface Props {
  campaignId: number;
  scheme: Grade[];
  /** Leads get the people they may hand a disagreement to; a reader (the third reader) gets null. */
  thirdReaders: ThirdReader[] | null;
  /** Refreshes what other features show after a settlement (confirmed table, counts). */
  onSettled?: () => void;
}

interface Settled {
  label: string;
  spectrumId: number;
  confirmedId: number;
}

/** The list of open disagreements beside the one being settled (chosen in the URL, else the first). */
export function DisagreementsView({ campaignId, scheme, thirdReaders, onSettled }: Props) {
  const list = useDisagreements(campaignId);
  const [params, setParams] = useSearchParams();
  const settle = useSettleDisagreement(campaignId, onSettled);
  const [settled, setSettled] = useState<Settled | null>(null);

  if (list.isPending) return <Loading label="Loading disagreements…" />;
  if (list.isError) return <ErrorNotice error={list.error} />;

  const items = list.data;
  const wanted = Number(params.get('disagreement'));
  const selected = items.find((d) => d.id === wanted) ?? items[0] ?? null;

  const status = settled ? (
    <Notice tone="success" role="status">
      Settled {settled.label}: confirmed record <span className="num">#{settled.confirmedId}</span> released.{' '}
      <Link to={`/spectra/${settled.spectrumId}`} className="underline underline-offset-2">
        Open the spectrum
      </Link>
    </Notice>
  ) : null;

  if (!selected) {
    return (
      <div className="flex flex-col gap-4">
        {status}
        <EmptyState title="No disagreements — every pair of readings agreed or was settled" />
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-4">
      {status}
      <p className="text-sm text-ink-600">
        <span className="num">{items.length}</span> open {items.length === 1 ? 'disagreement' : 'disagreements'}.
      </p>
      <div className="grid grid-cols-1 items-start gap-5 lg:grid-cols-[16rem_minmax(0,1fr)]">
        <DisagreementList items={items} selectedId={selected.id} />
        <DisagreementDetail
          key={selected.id}
          campaignId={campaignId}
          thirdReaders={thirdReaders}
          disagreement={selected}
          scheme={scheme}
          pending={settle.isPending}
          error={settle.error}
          onSettle={(body) => {
            settle.reset();
            settle.mutate(
              { id: selected.id, body },
              {
                onSuccess: ({ confirmedId }) => {
                  setSettled({ label: selected.target?.catalogueId ?? selected.fileName, spectrumId: selected.spectrumId, confirmedId });
                  // The settled item leaves the list; the next one (first remaining) is shown.
                  setParams({}, { replace: true });
                },
              },
            );
          }}
        />
      </div>
    </div>
  );
}
