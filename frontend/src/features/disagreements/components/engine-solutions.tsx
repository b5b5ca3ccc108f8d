import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { Table, tdClass, thClass } from '@/components/ui/table';
import { formatRedshift, formatRedshiftError } from '@/lib/format';
import { className } from '@/lib/spectrum-class';
import { useEngineSolutions } from '../api/get-engine-solutions';
import type { EngineSolution } from '../api/get-engine-solutions';

/** What the engine proposed, ranked, as a third opinion beside the two readers. */
export function EngineSolutions({ spectrumId, onUse }: { spectrumId: number; onUse: (solution: EngineSolution) => void }) {
  const scan = useEngineSolutions(spectrumId);
  if (scan.isPending) return <Loading label="Loading the engine's solutions…" />;
  if (scan.isError) return <ErrorNotice error={scan.error} />;
  if (!scan.data || scan.data.solutions.length === 0) return <p className="text-sm text-ink-500">The spectrum has not been scanned, so there are no solutions.</p>;
  return (
    <div className="flex flex-col gap-1">
      <p className="text-xs text-ink-500">Ranked by the scan of {scan.data.engineVersion}.</p>
      <Table caption="Engine solutions" captionHidden>
        <thead>
          <tr>
            <th scope="col" className={thClass}>Rank</th>
            <th scope="col" className={`${thClass} text-right`}>
              <span className="normal-case">z ± σ</span>
            </th>
            <th scope="col" className={thClass}>Class</th>
            <th scope="col" className={`${thClass} text-right`}>
              <span className="normal-case">Δχ²</span> to next
            </th>
            <th scope="col" className={thClass}>Lines</th>
            <th scope="col" className={thClass}>
              <span className="sr-only">Use</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {scan.data.solutions.map((s, i) => (
            <tr key={i}>
              <td className={`${tdClass} num`}>{i + 1}</td>
              <td className={`${tdClass} num whitespace-nowrap text-right`}>
                {formatRedshift(s.z)} ± {formatRedshiftError(s.zErr)}
              </td>
              <td className={tdClass}>{className(s.class)}</td>
              <td className={`${tdClass} num text-right`}>{s.deltaChi2 === null ? '—' : s.deltaChi2.toFixed(1)}</td>
              <td className={`${tdClass} text-sm`}>{s.lines.map((l) => l.name).join(', ') || '—'}</td>
              <td className={tdClass}>
                <button type="button" className="text-sm text-blueend-600 hover:underline" onClick={() => onUse(s)}>
                  Use solution {i + 1} as the value
                </button>
              </td>
            </tr>
          ))}
        </tbody>
      </Table>
    </div>
  );
}
