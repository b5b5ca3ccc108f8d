import { Button } from '@/components/ui/button';
import { Table, tdClass, thClass } from '@/components/ui/table';
import { formatBytes, formatCount } from '@/lib/format';

export const fileKey = (f: File) => `${f.webkitRelativePath || f.name}|${f.size}|${f.lastModified}`;

/** The files about to be sent, so a wrong folder is caught before minutes of uploading. */
export function ChosenFiles({ files, disabled, onRemove }: { files: File[]; disabled: boolean; onRemove: (file: File) => void }) {
  const bytes = files.reduce((sum, f) => sum + f.size, 0);
  return (
    <div className="flex flex-col gap-1">
      <div className="max-h-72 overflow-y-auto rounded-control border border-paper-200">
        <Table caption="Chosen files" captionHidden>
          <thead className="sticky top-0 bg-paper-50">
            <tr>
              <th className={thClass}>File</th>
              <th className={`${thClass} text-right`}>Size</th>
              <th className={thClass}>
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {files.map((f) => (
              <tr key={fileKey(f)}>
                <td className={`${tdClass} break-all`}>{f.webkitRelativePath || f.name}</td>
                <td className={`${tdClass} num whitespace-nowrap text-right`}>{formatBytes(f.size)}</td>
                <td className={`${tdClass} text-right`}>
                  <Button variant="quiet" size="sm" disabled={disabled} aria-label={`Remove ${f.name}`} onClick={() => onRemove(f)}>
                    Remove
                  </Button>
                </td>
              </tr>
            ))}
          </tbody>
        </Table>
      </div>
      <p className="text-sm text-ink-600">
        <span className="num">{formatCount(files.length)}</span> {files.length === 1 ? 'file' : 'files'}, <span className="num">{formatBytes(bytes)}</span> in all
      </p>
    </div>
  );
}
