import { Table } from '@/components/ui/table';
import { useStatistics } from '../../api/get-statistics';

const pct = (v: number) => `${(100 * v).toFixed(0)} %`;
const minutes = (ms: number | null) => (ms === null ? '—' : ms < 60_000 ? `${Math.round(ms / 1000)} s` : `${(ms / 60_000).toFixed(1)} min`);

/**
 * How often each pair of readers agreed by the campaign's rule, Cohen's κ on their grades
 * (1 = always the same grade, 0 = no better than chance), and how long each reader takes.
 */
export function ReaderAgreement({ campaignId }: { campaignId: number }) {
  const stats = useStatistics(campaignId);
  if (!stats.data) return null;
  const { readerPairs, readingTime } = stats.data;
  return (
    <div className="flex flex-col gap-4 lg:col-span-2">
      {readerPairs.length === 0 ? (
        <p className="text-sm text-ink-500">No spectrum has both readings yet, so there is no agreement to report.</p>
      ) : (
        <Table caption="Agreement between readers">
          <thead>
            <tr>
              <th scope="col">Readers</th>
              <th scope="col" className="text-right">Spectra read by both</th>
              <th scope="col" className="text-right">Agreed</th>
              <th scope="col" className="text-right">
                Cohen's <span className="normal-case">κ</span> on grades
              </th>
            </tr>
          </thead>
          <tbody>
            {readerPairs.map((p) => (
              <tr key={p.readers.join('|')}>
                <td>{p.readers.join(' and ')}</td>
                <td className="num text-right">{p.n}</td>
                <td className="num text-right">{pct(p.agreeFraction)}</td>
                <td className="num text-right">{p.kappaOnGrades === null ? 'undefined (one grade only)' : p.kappaOnGrades.toFixed(2)}</td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
      {readingTime.length > 0 ? (
        <Table caption="Reading time">
          <thead>
            <tr>
              <th scope="col">Reader</th>
              <th scope="col" className="text-right">Readings</th>
              <th scope="col" className="text-right">Median time per reading</th>
            </tr>
          </thead>
          <tbody>
            {readingTime.map((r) => (
              <tr key={r.reader}>
                <td>{r.reader}</td>
                <td className="num text-right">{r.readings}</td>
                <td className="num text-right">{minutes(r.medianMs)}</td>
              </tr>
            ))}
          </tbody>
        </Table>
      ) : null}
    </div>
  );
}
