import type { JobError } from '@contracts/ingest';
import { FilePath } from '@/components/ui/file-path';
import { Table, tdClass, thClass } from '@/components/ui/table';

/** Every file the engine could not use, with the server's own sentence, so it can be fixed and re-sent. */
export function FailedFiles({ errors, failedCount }: { errors: JobError[]; failedCount: number }) {
  if (errors.length === 0) return null;
  return (
    <div className="flex flex-col gap-1">
      <Table caption="Files that could not be read">
        <thead>
          <tr>
            <th className={thClass}>File</th>
            <th className={thClass}>Reason</th>
            <th className={thClass}>Code</th>
          </tr>
        </thead>
        <tbody>
          {errors.map((e, i) => (
            <tr key={`${e.file}-${i}`}>
              <td className={`${tdClass} font-medium`}>
                <FilePath path={e.file} />
              </td>
              <td className={tdClass}>{e.message}</td>
              <td className={`${tdClass} num whitespace-nowrap text-sm text-ink-500`}>{e.code}</td>
            </tr>
          ))}
        </tbody>
      </Table>
      {failedCount > errors.length ? (
        <p className="text-sm text-ink-500">
          The first <span className="num">{errors.length}</span> of <span className="num">{failedCount}</span> failures are listed.
        </p>
      ) : null}
    </div>
  );
}
