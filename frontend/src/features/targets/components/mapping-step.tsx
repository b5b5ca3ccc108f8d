import type { CatalogueImportResult, ColumnMapping } from '@contracts/targets';
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { formatCount } from '@/lib/format';
import { refusedCatalogue, useCheckCatalogue, useImportCatalogue } from '../api/import-catalogue';
import { useCataloguePreview } from '../hooks/use-catalogue-preview';
import { CataloguePreviewTable } from './catalogue-preview';
import { BandMappingFields } from './band-mapping-fields';
import { FilterCurveForm } from './filter-curve-form';
import { MappingFields } from './mapping-fields';
import { mappingFormSchema, toFormValues } from './mapping-schema';
import type { MappingFormValues } from './mapping-schema';
import { RowErrors } from './row-errors';

interface Props {
  campaignId: number;
  file: File;
  /** The server's first reading: columns, proposed mapping, row errors under that mapping. */
  proposal: CatalogueImportResult;
  onImported: (result: CatalogueImportResult) => void;
  onRestart: () => void;
}

export function MappingStep({ campaignId, file, proposal, onImported, onRestart }: Props) {
  const recheck = useCheckCatalogue(campaignId);
  const save = useImportCatalogue(campaignId);
  const preview = useCataloguePreview(file);
  const { register, handleSubmit, formState, watch } = useForm<MappingFormValues, unknown, ColumnMapping>({
    resolver: zodResolver(mappingFormSchema),
    defaultValues: toFormValues(proposal.mapping),
  });
  const values = watch();
  // Band rows live beside the form: a list whose length the person changes.
  const [bands, setBands] = useState(proposal.mapping?.bands ?? []);
  const withBands = (mapping: ColumnMapping): ColumnMapping => (bands.length > 0 ? { ...mapping, bands } : mapping);

  // The most recent word on the rows wins: a refused import, else the latest check.
  const refused = refusedCatalogue(save.error);
  const latest = refused ?? recheck.data ?? proposal;
  const otherImportError = save.isError && !refused ? save.error : null;

  const onCheck = handleSubmit((mapping) => {
    save.reset();
    recheck.mutate({ file, mapping: withBands(mapping) });
  });
  const onImport = handleSubmit((mapping) => save.mutate({ file, mapping: withBands(mapping) }, { onSuccess: onImported }));

  return (
    <div className="flex flex-col gap-4">
      {/* The curve form is a form of its own, so it sits beside the mapping form, not inside it. */}
      <FilterCurveForm campaignId={campaignId} />
      <form onSubmit={onImport} noValidate className="flex flex-col gap-4">
        <p className="text-ink-700">
          <span className="font-medium">{file.name}</span>: <span className="num">{formatCount(proposal.rows)}</span> rows,{' '}
          <span className="num">{proposal.columns.length}</span> columns. Check which column fills each field; unmapped columns are kept as extra data.
        </p>
        <MappingFields columns={proposal.columns} register={register} errors={formState.errors} />
        <BandMappingFields campaignId={campaignId} columns={proposal.columns} bands={bands} onChange={setBands} />
        {preview ? <CataloguePreviewTable preview={preview} mapping={values} bands={bands} /> : null}
        <RowErrors errors={latest.errors} />
        {recheck.isSuccess && !refused && recheck.data.errors.length === 0 ? (
          <Notice tone="success" role="status">
            All <span className="num">{formatCount(recheck.data.rows)}</span> rows read cleanly with this mapping.
          </Notice>
        ) : null}
        <ErrorNotice error={recheck.error} />
        {refused ? <ErrorNotice error={save.error} title="The import was refused" /> : <ErrorNotice error={otherImportError} />}
        <div className="flex flex-wrap gap-2">
          <Button type="submit" pending={save.isPending} pendingLabel="Importing…" disabled={recheck.isPending}>
            Import targets
          </Button>
          <Button variant="secondary" onClick={() => void onCheck()} pending={recheck.isPending} pendingLabel="Checking…" disabled={save.isPending}>
            Check the rows again
          </Button>
          <Button variant="quiet" onClick={onRestart} disabled={save.isPending}>
            Choose another file
          </Button>
        </div>
      </form>
    </div>
  );
}
