import type { TargetPhotometry } from '@contracts/targets';
import { Table, tdClass, thClass } from '@/components/ui/table';

/**
 * A spectrum's synthetic photometry against the catalogue, band by band: the flux-calibration and
 * slit-loss check. Uncalibrated spectra (no flux unit in the file) show only relative ratios.
 */
export function SpectrumPhotometryTable({ check, catalogue }: { check: TargetPhotometry['spectrumPhotometry'][number]; catalogue: TargetPhotometry['bands'] }) {
  const norm = check.calibrated || check.medianRatio === null || check.medianRatio === 0 ? 1 : check.medianRatio;
  return (
    <div className="flex flex-col gap-1">
      <Table caption={`Synthetic photometry of ${check.fileName} against the catalogue`}>
        <thead>
          <tr>
            <th scope="col" className={thClass}>Band</th>
            <th scope="col" className={`${thClass} text-right`}>Catalogue (nJy)</th>
            <th scope="col" className={`${thClass} text-right`}>{check.calibrated ? 'Spectrum (nJy)' : 'Spectrum (scaled)'}</th>
            <th scope="col" className={`${thClass} text-right`}>{check.calibrated ? 'Spectrum / catalogue' : 'Ratio / median ratio'}</th>
          </tr>
        </thead>
        <tbody>
          {check.bands.map((b) => {
            const c = catalogue.find((x) => x.filter === b.filter);
            return (
              <tr key={b.filter}>
                <td className={`${tdClass} num`}>{b.filter}</td>
                <td className={`${tdClass} num text-right`}>{c ? `${c.fluxNjy.toFixed(1)} ± ${c.errNjy.toFixed(1)}` : '—'}</td>
                <td className={`${tdClass} num text-right`}>
                  {b.fluxNjy.toFixed(1)} ± {b.errNjy.toFixed(1)}
                </td>
                <td className={`${tdClass} num text-right`}>
                  {(b.ratio / norm).toFixed(2)} ± {(b.ratioErr / Math.abs(norm)).toFixed(2)}
                </td>
              </tr>
            );
          })}
        </tbody>
      </Table>
      <p className="text-xs text-ink-600">
        {check.calibrated
          ? `Median spectrum / catalogue ratio ${check.medianRatio?.toFixed(2) ?? '—'}: below 1, light lost outside the slit or a calibration offset.`
          : 'The file states no flux unit: the spectrum is scaled to the catalogue by its median ratio, so only differences between bands (colour) can be read.'}{' '}
        Bands the spectrum covers to ≥ 95 % where the catalogue detects the target (≥ 2σ).
      </p>
    </div>
  );
}
