import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { formatDate, formatDegrees, formatRedshift } from '@/lib/format';
import { gradeText } from '@/lib/grade-label';
import type { SpectrumDetail } from '../api/schemas';
import type { SpectrumArrays } from '@/lib/decode-spectrum-data';
import { formatDec, formatRa } from '../utils/sky-position';
import { CLASS_NAMES } from '@/lib/spectrum-class';

function Facts({ label, children }: { label: string; children: ReactNode }) {
  return (
    <section aria-label={label} className="flex flex-col gap-1">
      <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-500">{label}</h3>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-sm">{children}</dl>
    </section>
  );
}

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <>
      <dt className="text-ink-500">{term}</dt>
      <dd className="min-w-0 text-ink-900 [overflow-wrap:anywhere]">{children}</dd>
    </>
  );
}

const dash = <span className="text-ink-400">—</span>;

/** The normalised unit and, when it differs, the file's own spelling; an unknown unit is said to be one. */
function FluxUnitText({ unit }: { unit: SpectrumDetail['spectrum']['fluxUnit'] }) {
  if (unit === null) return dash;
  if (unit.quantity === 'arbitrary') {
    return <>arbitrary{unit.raw === null ? ' (the file states none)' : <span className="text-ink-600"> (file: “{unit.raw}”)</span>}</>;
  }
  const scale = unit.scale === 1 ? '' : `${Number(unit.scale.toPrecision(3))} × `;
  return (
    <>
      <span className="num">
        {scale}
        {unit.unit}
      </span>
      {unit.raw !== null ? <span className="block text-xs text-ink-500">file: “{unit.raw}”</span> : null}
    </>
  );
}

function Position({ ra, dec }: { ra: number | null; dec: number | null }) {
  if (ra === null || dec === null) return dash;
  return (
    <span className="num">
      {formatRa(ra)} {formatDec(dec)}
      <span className="block text-xs text-ink-500">
        {formatDegrees(ra)}° {formatDegrees(dec)}°
      </span>
    </span>
  );
}

/** Who the target is, what the spectrum is, and what the engine assumed when it scanned it. */
export function ContextPanel({ detail, arrays }: { detail: SpectrumDetail; arrays: SpectrumArrays | undefined }) {
  const { spectrum: s, target: t, scan, family } = detail;
  return (
    <div className="flex flex-col gap-4">
      <Facts label="Target">
        {t ? (
          <>
            <Fact term="Target">
              <span className="num font-medium">{t.catalogueId}</span>
              {t.priority !== null ? <span className="text-xs text-ink-500"> · priority {t.priority}</span> : null}
            </Fact>
            <Fact term="Position">
              <Position ra={t.ra} dec={t.dec} />
            </Fact>
            <Fact term="Magnitude">{t.magnitude === null ? dash : <span className="num">{t.magnitude.toFixed(2)}</span>}</Fact>
            <Fact term="Photo-z">
              {t.photoZ === null ? (
                dash
              ) : (
                <span className="num">
                  {t.photoZ.toFixed(3)}
                  {t.photoZLow !== null && t.photoZHigh !== null ? (
                    <span className="text-ink-500">
                      {' '}
                      (68 %: {t.photoZLow.toFixed(3)}–{t.photoZHigh.toFixed(3)})
                    </span>
                  ) : null}
                </span>
              )}
            </Fact>
            {t.photoZFit ? (
              <Fact term="Photo-z from fluxes">
                <span className="num">
                  {t.photoZFit.z.toFixed(2)}
                  <span className="text-ink-500">
                    {' '}
                    (95 %: {t.photoZFit.z95[0].toFixed(2)}–{t.photoZFit.z95[1].toFixed(2)}; P(z &lt; 2) {(100 * t.photoZFit.pLowZ).toFixed(t.photoZFit.pLowZ < 0.1 ? 1 : 0)} %{t.photoZFit.class === 'star' ? '; a star fits better' : ''})
                  </span>
                </span>
              </Fact>
            ) : null}
          </>
        ) : (
          <Fact term="Target">
            <span className="italic text-ink-500">not linked to a catalogue target</span>
          </Fact>
        )}
      </Facts>

      {t?.imageFamily ? (
        <section aria-label="Image family" className="flex flex-col gap-1">
          <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-500">Image family {t.imageFamily}</h3>
          {family.length === 0 ? (
            <p className="text-sm text-ink-500">No other member has a spectrum yet.</p>
          ) : (
            <ul className="flex flex-col gap-1 text-sm">
              {family.map((m) => (
                <li key={m.spectrumId}>
                  <Link to={`/spectra/${m.spectrumId}`} className="num font-medium text-blueend-600 hover:underline">
                    {m.catalogueId}
                  </Link>
                  <span className="text-ink-600"> · top z {formatRedshift(m.zBest)}</span>
                  {m.readings.map((r) => (
                    <span key={r.id} className="block pl-3 text-xs text-ink-600">
                      {r.reader.name} ({r.readingOrder}): <span className="num">z = {formatRedshift(r.z)}</span>, grade {gradeText(detail.campaign.gradeScheme, r.grade)}, {CLASS_NAMES[r.class]}
                    </span>
                  ))}
                  {m.readings.length === 0 ? <span className="block pl-3 text-xs text-ink-500">no reading you may see</span> : null}
                </li>
              ))}
            </ul>
          )}
        </section>
      ) : null}

      <Facts label="Spectrum">
        <Fact term="File">{s.fileName}</Fact>
        {s.objectName ? <Fact term="Object">{s.objectName}</Fact> : null}
        <Fact term="Instrument">{s.instrument ?? dash}</Fact>
        <Fact term="Exposure">{s.exposureS === null ? dash : <span className="num">{s.exposureS.toLocaleString('en')} s</span>}</Fact>
        {s.dateObs ? <Fact term="Observed">{formatDate(s.dateObs)}</Fact> : null}
        {s.ra !== null && s.dec !== null ? (
          <Fact term="Pointing">
            <Position ra={s.ra} dec={s.dec} />
          </Fact>
        ) : null}
        <Fact term="Flux unit">
          <FluxUnitText unit={arrays?.fluxUnit ?? s.fluxUnit} />
        </Fact>
        <Fact term="Pixels · λ">
          <span className="num">
            {s.pixels.toLocaleString('en')} · {s.wavelengthMin.toFixed(0)}–{s.wavelengthMax.toFixed(0)} Å
          </span>
        </Fact>
        <Fact term="Median S/N">{s.snrMedian === null ? dash : <span className="num">{s.snrMedian.toFixed(1)}</span>}</Fact>
        <Fact term="Errors">{s.errorsEstimated ? 'estimated from local scatter (file had none)' : 'from the file'}</Fact>
        {s.warnings.length > 0 ? (
          <Fact term="Warnings">
            <ul className="list-disc pl-4">
              {s.warnings.map((w) => (
                <li key={w}>{w}</li>
              ))}
            </ul>
          </Fact>
        ) : null}
      </Facts>

      <Facts label="What the engine assumed">
        <Fact term="Medium">
          {arrays ? (arrays.convertedFromAir ? 'air in the file, converted to vacuum' : 'vacuum') : s.medium}
          {scan && !arrays ? ` (scan read ${scan.meta.medium})` : ''}
        </Fact>
        {scan ? (
          <>
            <Fact term="Range">
              <span className="num">
                {scan.meta.zMin} ≤ z ≤ {scan.meta.zMax}
              </span>
            </Fact>
            <Fact term="Masks">{scan.meta.masks.length ? scan.meta.masks.join(', ') : 'none'}</Fact>
            <Fact term="Templates">{scan.meta.templates.join(', ')}</Fact>
            <Fact term="Grid step">
              <span className="num">{scan.meta.step} dex/pixel</span>
            </Fact>
            <Fact term="Engine">{scan.engineVersion}</Fact>
          </>
        ) : (
          <Fact term="Scan">not scanned yet</Fact>
        )}
      </Facts>
    </div>
  );
}
