import { useEffect, useRef } from 'react';
import { Link } from 'react-router-dom';
import { Loading } from '@/components/ui/loading';
import { ErrorNotice } from '@/components/ui/notice';
import { useTargetPhotometry } from '../api/get-target-photometry';
import { formatInterval, formatPercent } from './photo-z-words';
import { PosteriorPlot } from './posterior-plot';
import { SedPlot } from './sed-plot';
import { SpectrumPhotometryTable } from './spectrum-photometry-table';

/** One target's computed photometric redshift: summary, P(z), SED with the best templates, assumptions, its spectra. */
export function TargetPhotometryPanel({ campaignId, targetId, onClose }: { campaignId: number; targetId: number; onClose: () => void }) {
  const photometry = useTargetPhotometry(campaignId, targetId);
  const section = useRef<HTMLElement>(null);
  const loaded = photometry.isSuccess;
  // The panel sits above the table: bring it into view when a target far down the list opens it.
  useEffect(() => {
    if (loaded) section.current?.scrollIntoView?.({ block: 'nearest' });
  }, [loaded, targetId]);
  if (photometry.isPending) return <Loading label="Loading the photometry…" />;
  if (photometry.isError) return <ErrorNotice error={photometry.error} title="The photometry could not be loaded" />;
  const p = photometry.data;
  const fit = p.fit;
  const galaxy = p.models.find((m) => m.kind === 'galaxy');
  const star = p.models.find((m) => m.kind === 'star');
  const check = p.spectrumPhotometry[0];
  return (
    <section ref={section} aria-label={`Photometry of ${p.catalogueId}`} className="flex flex-col gap-3 rounded-panel border border-paper-300 bg-paper-100 p-3">
      <div className="flex items-baseline justify-between gap-3">
        <h3 className="text-md font-semibold text-ink-900">Photometry of {p.catalogueId}</h3>
        <button type="button" onClick={onClose} className="text-sm text-ink-600 underline hover:text-ink-900">
          Close
        </button>
      </div>
      {p.bands.length === 0 ? (
        <p className="text-ink-700">The catalogue gave no band fluxes for this target.</p>
      ) : (
        <>
          {fit ? (
            <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-4">
              <dt className="text-ink-600">Photometric z</dt>
              <dd className="num font-medium">{fit.z.toFixed(2)}</dd>
              <dt className="text-ink-600">68 % / 95 %</dt>
              <dd className="num">
                {formatInterval(fit.z68)} / {formatInterval(fit.z95)}
              </dd>
              <dt className="text-ink-600">P(z &lt; 2), interloper odds</dt>
              <dd className="num">{formatPercent(fit.pLowZ)}</dd>
              <dt className="text-ink-600">Star or galaxy</dt>
              <dd className="num">
                {fit.class === 'star' ? 'star' : 'galaxy'} (χ² star {fit.starChi2.toFixed(1)}, galaxy {fit.galaxyChi2.toFixed(1)})
              </dd>
            </dl>
          ) : null}
          {fit?.class === 'star' ? (
            <p className="text-sm text-warning-700">A star fits these fluxes better than any galaxy template: treat this target as a likely Milky Way dwarf; P(z) below is that of the galaxy templates alone.</p>
          ) : null}
          <div className="grid grid-cols-1 gap-3 lg:grid-cols-2">
            {fit && p.posterior ? (
              <figure>
                <PosteriorPlot posterior={p.posterior} fit={fit} label={`P(z) of ${p.catalogueId}: best z ${fit.z.toFixed(2)}, 95 % interval ${formatInterval(fit.z95)}`} />
                <figcaption className="text-xs text-ink-600">P(z) under a flat prior; shaded: 68 % (dark) and 95 % intervals; hatched: z &lt; 2.</figcaption>
              </figure>
            ) : null}
            <figure>
              <SedPlot photometry={p} {...(check ? { synthetic: check.bands } : {})} label={`Spectral energy distribution of ${p.catalogueId}: ${p.bands.length} bands, ${p.bands.filter((b) => !b.detected).length} upper limits`} />
              <figcaption className="text-xs text-ink-600">
                Points: fluxes ± 1σ; arrows: 2σ upper limits (below 2σ).{' '}
                {galaxy ? (
                  <>
                    Solid: best galaxy <span className="num">{galaxy.template}</span> at z = {galaxy.z.toFixed(2)} (χ² {galaxy.chi2.toFixed(1)}).{' '}
                  </>
                ) : null}
                {star ? (
                  <>
                    Dashed: best star <span className="num">{star.template}</span> (χ² {star.chi2.toFixed(1)}).{' '}
                  </>
                ) : null}
                {check ? <>Green diamonds: synthetic photometry of {check.fileName}{check.calibrated ? '' : ' (scaled)'}.</> : null}
              </figcaption>
            </figure>
          </div>
          {p.spectrumPhotometry.map((c) => (
            <SpectrumPhotometryTable key={c.spectrumId} check={c} catalogue={p.bands} />
          ))}
          {p.assumptions.length > 0 ? (
            <details className="text-xs text-ink-700">
              <summary className="cursor-pointer">What the fit assumed</summary>
              <ul className="mt-1 list-disc pl-5">
                {p.assumptions.map((a) => (
                  <li key={a}>{a}</li>
                ))}
              </ul>
            </details>
          ) : null}
        </>
      )}
      {p.spectra.length > 0 ? (
        <p className="text-sm">
          Spectra:{' '}
          {p.spectra.map((s, i) => (
            <span key={s.id}>
              {i > 0 ? ', ' : ''}
              <Link to={`/spectra/${s.id}`} className="text-blueend-600 underline">
                {s.fileName}
              </Link>
            </span>
          ))}
        </p>
      ) : null}
    </section>
  );
}
