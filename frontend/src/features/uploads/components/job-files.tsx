import type { JobFile } from '@contracts/ingest';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { FilePath } from '@/components/ui/file-path';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { Table, tdClass, thClass } from '@/components/ui/table';
import { formatCount, formatRedshift } from '@/lib/format';
import { CLASS_NAMES, isSpectrumClass } from '@/lib/spectrum-class';
import { useJobFiles } from '../api/get-job-files';

/** Rows shown before "Show all": a 5,000-file archive stays quick to open. */
const FIRST_ROWS = 200;
const LINK_METHODS: Record<string, string> = { 'file-name': 'id in the file name', 'object-keyword': 'OBJECT keyword', position: 'position', manual: 'by hand' };

/**
 * What became of every file of a finished job: stored, duplicate or failed (with the server's
 * sentence); the target it was linked to, or what to do when none; the top solution once
 * scanned, with a link to the spectrum; and whether readers are assigned.
 */
export function JobFiles({ jobId, campaignId }: { jobId: number; campaignId: number }) {
  const files = useJobFiles(jobId, true);
  const [all, setAll] = useState(false);
  if (files.isPending) return <Loading label="Loading the files of the job…" />;
  if (files.isError) return <ErrorNotice error={files.error} title="The list of files could not be loaded" />;
  const { files: rows, total, truncated } = files.data;
  if (rows.length === 0) return null;
  const shown = all ? rows : rows.slice(0, FIRST_ROWS);
  const unlinked = rows.filter((f) => f.outcome === 'stored' && f.target === null).length;
  return (
    <div className="flex flex-col gap-2">
      <Table caption="What happened to each file">
        <thead>
          <tr>
            <th className={thClass}>File</th>
            <th className={thClass}>Outcome</th>
            <th className={thClass}>Target</th>
            <th className={thClass}>Top solution</th>
            <th className={thClass}>Readers</th>
          </tr>
        </thead>
        <tbody>
          {shown.map((f, i) => (
            <FileRow key={`${f.file}-${i}`} file={f} campaignId={campaignId} />
          ))}
        </tbody>
      </Table>
      {unlinked > 0 ? (
        <p className="text-sm text-ink-700">
          <span className="num">{formatCount(unlinked)}</span> new {unlinked === 1 ? 'spectrum is' : 'spectra are'} not linked to a target: import a catalogue whose ids appear in the file names or OBJECT
          keywords (they link on import), or link them by hand on the{' '}
          <Link to={`/campaigns/${campaignId}/spectra?linked=no`} className="text-blueend-600 underline-offset-2 hover:underline">
            spectra list
          </Link>
          .
        </p>
      ) : null}
      {!all && rows.length > FIRST_ROWS ? (
        <div>
          <Button variant="secondary" size="sm" onClick={() => setAll(true)}>
            Show all {formatCount(rows.length)} files
          </Button>
        </div>
      ) : null}
      {truncated ? (
        <p className="text-sm text-ink-500">
          The first <span className="num">{formatCount(rows.length)}</span> of <span className="num">{formatCount(total)}</span> files are listed.
        </p>
      ) : null}
    </div>
  );
}

function FileRow({ file: f, campaignId }: { file: JobFile; campaignId: number }) {
  const spectrumLink = (text: string) =>
    f.spectrumId === null ? (
      text
    ) : (
      <Link to={`/spectra/${f.spectrumId}`} className="font-medium text-blueend-600 underline-offset-2 hover:underline">
        {text}
      </Link>
    );
  return (
    <tr>
      <td className={`${tdClass} font-medium`}>
        <FilePath path={f.file} />
      </td>
      <td className={tdClass}>
        <Outcome file={f} />
      </td>
      <td className={tdClass}>
        {f.target ? (
          <>
            <span className="num">{f.target.catalogueId}</span>
            {f.target.linkMethod ? <span className="block text-xs text-ink-500">by {LINK_METHODS[f.target.linkMethod] ?? f.target.linkMethod}</span> : null}
          </>
        ) : f.spectrumId !== null ? (
          <span className="text-ink-700">
            not linked
            <span className="block text-xs text-ink-500">
              {f.objectName ? `OBJECT “${f.objectName}” matches no target; ` : ''}
              <Link to={`/campaigns/${campaignId}/spectra?linked=no`} className="text-blueend-600 underline-offset-2 hover:underline">
                link it
              </Link>{' '}
              or import a catalogue
            </span>
          </span>
        ) : (
          <span className="text-ink-400">—</span>
        )}
      </td>
      <td className={tdClass}>
        {f.scan ? (
          <>
            {spectrumLink(f.scan.zBest === null ? 'no solution' : `z = ${formatRedshift(f.scan.zBest)}`)}
            <span className="block text-xs text-ink-600">{isSpectrumClass(f.scan.spectrumClass) ? CLASS_NAMES[f.scan.spectrumClass] : f.scan.spectrumClass}</span>
          </>
        ) : f.spectrumId !== null ? (
          spectrumLink('not scanned')
        ) : (
          <span className="text-ink-400">—</span>
        )}
      </td>
      <td className={`${tdClass} num whitespace-nowrap`}>{f.spectrumId === null ? <span className="text-ink-400">—</span> : `${f.readersAssigned} of 2`}</td>
    </tr>
  );
}

function Outcome({ file: f }: { file: JobFile }) {
  if (f.state === 'failed' && f.outcome === null) {
    return (
      <>
        <Badge tone="danger">failed</Badge>
        <span className="block text-sm text-ink-700">{f.error?.message}</span>
        {f.error ? <span className="num block text-xs text-ink-500">{f.error.code}</span> : null}
      </>
    );
  }
  if (f.state === 'pending') return <Badge tone="ink">waiting</Badge>;
  if (f.outcome === 'duplicate') {
    return (
      <>
        <Badge tone="ink">duplicate</Badge>
        <span className="block text-xs text-ink-500">already in the campaign; stored once</span>
      </>
    );
  }
  return (
    <>
      <Badge tone="success">{f.outcome === 'rescanned' ? 're-scanned' : 'stored'}</Badge>
      {f.state === 'failed' && f.error ? <span className="block text-sm text-ink-700">{f.error.message}</span> : null}
    </>
  );
}
