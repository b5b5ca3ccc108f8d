import { useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { FileDrop } from '@/components/ui/file-drop';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { ProgressBar } from '@/components/ui/progress-bar';
import { formatBytes, formatCount } from '@/lib/format';
import type { BytesSent } from '@/lib/send-form';
import { useUploadSpectra } from '../api/upload-spectra';
import { ACCEPT_ATTRIBUTE, isAcceptedFile } from './accepted-files';
import { ChosenFiles, fileKey } from './chosen-files';

const isAbort = (e: unknown) => e instanceof DOMException && e.name === 'AbortError';

/** Choose spectra or zips, send them with a byte-accurate bar, and hand the job id on. */
export function SpectraUploadForm({ campaignId, onUploaded }: { campaignId: number; onUploaded: (jobId: number) => void }) {
  const upload = useUploadSpectra(campaignId);
  const [files, setFiles] = useState<File[]>([]);
  const [skipped, setSkipped] = useState<string[]>([]);
  const [sent, setSent] = useState<BytesSent | null>(null);
  const abort = useRef<AbortController | null>(null);

  const add = (incoming: File[]) => {
    upload.reset();
    const accepted = incoming.filter((f) => isAcceptedFile(f.name));
    setSkipped(incoming.filter((f) => !isAcceptedFile(f.name)).map((f) => f.webkitRelativePath || f.name));
    setFiles((current) => {
      const seen = new Set(current.map(fileKey));
      return [...current, ...accepted.filter((f) => !seen.has(fileKey(f)))];
    });
  };

  const start = () => {
    abort.current = new AbortController();
    setSent({ loaded: 0, total: files.reduce((s, f) => s + f.size, 0) });
    upload.mutate(
      { files, onProgress: setSent, signal: abort.current.signal },
      {
        onSuccess: (receipt) => {
          setFiles([]);
          onUploaded(receipt.jobId);
        },
        onSettled: () => setSent(null),
      },
    );
  };

  const busy = upload.isPending;
  const allSent = sent !== null && sent.total > 0 && sent.loaded >= sent.total;

  return (
    <div className="flex flex-col gap-3">
      <FileDrop pickLabel="Choose files" folderLabel="Choose a folder" accept={ACCEPT_ATTRIBUTE} multiple disabled={busy} onFiles={add}>
        <p className="text-ink-700">Drop spectra here: FITS, text tables (CSV, TSV, whitespace), or zip archives of them.</p>
      </FileDrop>
      {skipped.length > 0 ? (
        <Notice tone="warning" role="status">
          Left out <span className="num">{formatCount(skipped.length)}</span> {skipped.length === 1 ? 'file' : 'files'} that {skipped.length === 1 ? 'is' : 'are'} not a spectrum format:{' '}
          {skipped.slice(0, 5).join(', ')}
          {skipped.length > 5 ? ' …' : ''}
        </Notice>
      ) : null}
      {files.length > 0 ? <ChosenFiles files={files} disabled={busy} onRemove={(f) => setFiles((c) => c.filter((x) => x !== f))} /> : null}
      {upload.isError && !isAbort(upload.error) ? <ErrorNotice error={upload.error} title="The upload was refused" /> : null}
      {upload.isError && isAbort(upload.error) ? (
        <Notice tone="info" role="status">
          Upload stopped. Nothing was stored.
        </Notice>
      ) : null}
      {sent ? (
        <div className="flex flex-col gap-1">
          <ProgressBar label="Upload progress" value={sent.loaded} max={sent.total} valueText={`${formatBytes(sent.loaded)} of ${formatBytes(sent.total)}`} />
          {/* After the last byte the server still unpacks archives and hashes every file before it answers. */}
          {allSent ? <p className="text-sm text-ink-600" role="status">All bytes sent; the server is unpacking and storing the files…</p> : null}
        </div>
      ) : null}
      <div className="flex gap-2">
        <Button disabled={files.length === 0} pending={busy} pendingLabel="Uploading…" onClick={start}>
          Upload
        </Button>
        {busy ? (
          <Button variant="secondary" onClick={() => abort.current?.abort()} disabled={allSent}>
            Stop upload
          </Button>
        ) : files.length > 0 ? (
          <Button variant="quiet" onClick={() => setFiles([])}>
            Clear the list
          </Button>
        ) : null}
      </div>
    </div>
  );
}
