import { Notice } from '@/components/ui/notice';
import { Table, tdClass, thClass } from '@/components/ui/table';
import { formatCount } from '@/lib/format';
import type { AssignResult } from '../api/assign-readers';

export function AssignResultTable({ result }: { result: AssignResult }) {
  if (result.assigned === 0) {
    return (
      <Notice tone="info" role="status">
        Nothing to assign: every spectrum already has its two readers.
      </Notice>
    );
  }
  return (
    <div role="status" className="flex flex-col gap-2">
      <Notice tone="success">
        <span className="num">{formatCount(result.assigned)}</span> {result.assigned === 1 ? 'spectrum' : 'spectra'} assigned; each reader was e-mailed a summary.
      </Notice>
      <Table caption="New assignments per reader">
        <thead>
          <tr>
            <th scope="col" className={thClass}>Reader</th>
            <th scope="col" className={`${thClass} text-right`}>First readings</th>
            <th scope="col" className={`${thClass} text-right`}>Second readings</th>
          </tr>
        </thead>
        <tbody>
          {result.perReader.map((r) => (
            <tr key={r.readerId}>
              <td className={tdClass}>{r.name}</td>
              <td className={`${tdClass} num text-right`}>{formatCount(r.first)}</td>
              <td className={`${tdClass} num text-right`}>{formatCount(r.second)}</td>
            </tr>
          ))}
        </tbody>
      </Table>
    </div>
  );
}
