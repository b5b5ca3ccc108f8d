import type { CatalogueImportResult } from '@contracts/targets';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { FileDrop } from '@/components/ui/file-drop';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { Stats } from '@/components/ui/stats';
import { formatCount } from '@/lib/format';
import { useCheckCatalogue } from '../api/import-catalogue';
import { MappingStep } from './mapping-step';
import { PhotoZJobProgress } from './photo-z-job-progress';

/**
 * Catalogue import in three steps: choose a file (the server reads it and proposes a
 * mapping), confirm the mapping against a preview and the row errors, import.
 */
export function CatalogueImport({ campaignId, onImported }: { campaignId: number; onImported?: (result: CatalogueImportResult) => void }) {
  const check = useCheckCatalogue(campaignId);
  const [file, setFile] = useState<File | null>(null);
  const [imported, setImported] = useState<CatalogueImportResult | null>(null);

  const choose = (files: File[]) => {
    const chosen = files[0];
    if (!chosen) return;
    setFile(chosen);
    setImported(null);
    check.mutate({ file: chosen });
  };
  const restart = () => {
    setFile(null);
    setImported(null);
    check.reset();
  };

  if (imported) {
    return (
      <div className="flex flex-col gap-3">
        <Notice tone="success" role="status">
          Imported {file?.name}.
        </Notice>
        <Stats
          label="Catalogue import result"
          stats={[
            { term: 'Rows', value: formatCount(imported.rows) },
            { term: 'Created', value: formatCount(imported.created) },
            { term: 'Updated', value: formatCount(imported.updated) },
            { term: 'Spectra linked', value: formatCount(imported.linked) },
            ...(imported.photoZJobId === null ? [{ term: 'Photo-z computed', value: formatCount(imported.photoZFits) }] : []),
          ]}
        />
        {imported.photoZJobId !== null ? <PhotoZJobProgress campaignId={campaignId} jobId={imported.photoZJobId} /> : null}
        <div>
          <Button variant="secondary" onClick={restart}>
            Import another catalogue
          </Button>
        </div>
      </div>
    );
  }

  if (!file) {
    return (
      <FileDrop pickLabel="Choose a catalogue" accept=".csv,.tsv,.txt,.dat" onFiles={choose}>
        <p className="text-ink-700">Drop a target catalogue here: CSV or TSV with a header line naming the columns.</p>
        <p className="text-sm text-ink-500">Re-importing updates targets by catalogue id; readings on their spectra are kept.</p>
      </FileDrop>
    );
  }

  return (
    <div className="flex flex-col gap-3">
      {check.isPending && !check.data ? <Loading label={`Reading ${file.name}…`} /> : null}
      {check.isError ? (
        <>
          <ErrorNotice error={check.error} title={`${file.name} could not be read`} />
          <div>
            <Button variant="secondary" onClick={restart}>
              Choose another file
            </Button>
          </div>
        </>
      ) : null}
      {check.data ? (
        <MappingStep
          key={`${file.name}-${file.lastModified}-${file.size}`}
          campaignId={campaignId}
          file={file}
          proposal={check.data}
          onImported={(result) => {
            setImported(result);
            onImported?.(result);
          }}
          onRestart={restart}
        />
      ) : null}
    </div>
  );
}
