import { FLUX_UNITS } from '@contracts/targets';
import type { BandMapping, FluxUnitName } from '@contracts/targets';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { useFilters } from '../api/get-filters';

export const UNIT_LABELS: Record<FluxUnitName, string> = { nJy: 'nJy', uJy: 'µJy', ABmag: 'AB magnitude' };

/**
 * The catalogue's band columns: per band a filter (shipped or the campaign's own), the flux (or
 * magnitude) column, its error column and the unit. Bands feed the photometric redshift.
 */
export function BandMappingFields({ campaignId, columns, bands, onChange }: { campaignId: number; columns: string[]; bands: BandMapping[]; onChange: (bands: BandMapping[]) => void }) {
  const filters = useFilters(campaignId);
  const set = (i: number, patch: Partial<BandMapping>) => onChange(bands.map((b, k) => (k === i ? { ...b, ...patch } : b)));
  const names = filters.data?.map((f) => f.name) ?? [];
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="text-sm font-medium text-ink-800">Band fluxes for the photometric redshift</legend>
      <p className="text-sm text-ink-500">
        Non-detections stay as measured (zero or negative flux with its error). For magnitudes, 99 in the magnitude column marks a non-detection whose error column gives the 1σ limiting magnitude. Leave both cells empty where a band was not observed.
      </p>
      {bands.length === 0 ? <p className="text-sm text-ink-600">No band columns mapped: no photometric redshift will be computed.</p> : null}
      {bands.map((b, i) => (
        <div key={i} role="group" aria-label={`Band ${i + 1}`} className="grid grid-cols-2 items-end gap-2 sm:grid-cols-5">
          <SelectField label="Filter" value={b.filter} onChange={(e) => set(i, { filter: e.target.value })}>
            {names.includes(b.filter) || b.filter === '' ? null : <option value={b.filter}>{b.filter}</option>}
            <option value="">Choose a filter…</option>
            {names.map((n) => (
              <option key={n} value={n}>
                {n}
              </option>
            ))}
          </SelectField>
          <SelectField label="Flux column" value={b.flux} onChange={(e) => set(i, { flux: e.target.value })}>
            <option value="">Choose a column…</option>
            {columns.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </SelectField>
          <SelectField label="Error column" value={b.err} onChange={(e) => set(i, { err: e.target.value })}>
            <option value="">Choose a column…</option>
            {columns.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </SelectField>
          <SelectField label="Unit" value={b.unit} onChange={(e) => set(i, { unit: e.target.value as FluxUnitName })}>
            {FLUX_UNITS.map((u) => (
              <option key={u} value={u}>
                {UNIT_LABELS[u]}
              </option>
            ))}
          </SelectField>
          <Button variant="quiet" size="sm" onClick={() => onChange(bands.filter((_, k) => k !== i))}>
            Remove band
          </Button>
        </div>
      ))}
      <div>
        <Button variant="secondary" size="sm" onClick={() => onChange([...bands, { filter: '', flux: '', err: '', unit: 'nJy' }])}>
          Add a band
        </Button>
      </div>
    </fieldset>
  );
}
