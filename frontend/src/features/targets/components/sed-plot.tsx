import type { TargetPhotometry } from '@contracts/targets';

const W = 420;
const H = 200;
const PAD = { left: 46, right: 10, top: 10, bottom: 30 };
/** Upper limits are drawn at max(flux, 0) + 2σ (the detection threshold the server uses). */
const LIMIT_SIGMA = 2;

export interface SyntheticBand {
  filter: string;
  wavelengthEff: number;
  fluxNjy: number;
}

/**
 * The spectral energy distribution: f_ν (nJy, linear so negative fluxes of non-detections show)
 * against log λ; detections as points with 1σ bars, non-detections as 2σ upper limits (arrows), the
 * best galaxy (solid) and best star (dashed) drawn through the bands with their band fluxes as open
 * squares, and, when given, the spectrum's own synthetic photometry as diamonds.
 */
export function SedPlot({ photometry, synthetic, label }: { photometry: TargetPhotometry; synthetic?: SyntheticBand[]; label: string }) {
  const { bands, models } = photometry;
  const lamLo = Math.log10(bands[0]!.wavelengthEff * 0.8);
  const lamHi = Math.log10(bands[bands.length - 1]!.wavelengthEff * 1.25);
  const values = [
    ...bands.flatMap((b) => [b.fluxNjy - b.errNjy, Math.max(b.fluxNjy, 0) + Math.max(b.errNjy, LIMIT_SIGMA * b.errNjy)]),
    ...models.flatMap((m) => m.bandFluxNjy),
    ...(synthetic ?? []).map((s) => s.fluxNjy),
  ];
  const yLo = Math.min(0, ...values);
  const yHi = Math.max(...values, 1) * 1.1;
  const x = (lam: number) => PAD.left + ((W - PAD.left - PAD.right) * (Math.log10(lam) - lamLo)) / (lamHi - lamLo);
  const y = (f: number) => H - PAD.bottom - ((H - PAD.top - PAD.bottom) * (Math.min(yHi, Math.max(yLo, f)) - yLo)) / (yHi - yLo);
  const path = (m: TargetPhotometry['models'][number]) =>
    m.curve.wavelength
      .map((lam, i) => [lam, m.curve.fnuNjy[i]!] as const)
      .filter(([lam]) => Math.log10(lam) >= lamLo && Math.log10(lam) <= lamHi)
      .map(([lam, f], i) => `${i === 0 ? 'M' : 'L'}${x(lam).toFixed(1)},${y(f).toFixed(1)}`)
      .join('');
  const micronTicks = [0.4, 0.6, 0.8, 1, 1.5, 2, 3, 4, 5, 8].filter((u) => Math.log10(u * 1e4) >= lamLo && Math.log10(u * 1e4) <= lamHi);
  const fluxTicks = niceTicks(yLo, yHi);
  return (
    <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={label} className="w-full max-w-xl">
      <title>{label}</title>
      <line x1={PAD.left} x2={W - PAD.right} y1={y(0)} y2={y(0)} className="stroke-paper-400" strokeDasharray="2 2" />
      {models.map((m) => (
        <path key={m.kind} d={path(m)} className={`fill-none ${m.kind === 'galaxy' ? 'stroke-ember-500' : 'stroke-blueend-500'}`} strokeWidth="1" strokeDasharray={m.kind === 'star' ? '4 3' : undefined} />
      ))}
      {models.flatMap((m) =>
        m.bandFluxNjy.map((f, i) => (
          <rect key={`${m.kind}-${i}`} x={x(bands[i]!.wavelengthEff) - 3} y={y(f) - 3} width="6" height="6" className={`fill-none ${m.kind === 'galaxy' ? 'stroke-ember-600' : 'stroke-blueend-600'}`} />
        )),
      )}
      {(synthetic ?? []).map((s) => (
        <path key={`syn-${s.filter}`} d={`M${x(s.wavelengthEff)},${y(s.fluxNjy) - 5}l5,5l-5,5l-5,-5z`} className="fill-success-700/70">
          <title>{`${s.filter}: spectrum ${s.fluxNjy.toFixed(1)} nJy`}</title>
        </path>
      ))}
      {bands.map((b) => {
        const cx = x(b.wavelengthEff);
        if (!b.detected) {
          const top = y(Math.max(b.fluxNjy, 0) + LIMIT_SIGMA * b.errNjy);
          // The arrow points down from the limit, kept inside the plotting area.
          const tip = Math.min(top + 17, H - PAD.bottom - 1);
          return (
            <g key={b.filter} data-band={b.filter} data-limit="true" className="stroke-ink-900">
              <title>{`${b.filter}: ${b.fluxNjy.toFixed(1)} ± ${b.errNjy.toFixed(1)} nJy (below ${LIMIT_SIGMA}σ: upper limit)`}</title>
              <line x1={cx - 5} x2={cx + 5} y1={top} y2={top} strokeWidth="1.5" />
              <line x1={cx} x2={cx} y1={top} y2={tip} strokeWidth="1.2" />
              <path d={`M${cx - 3},${tip - 5}L${cx},${tip}L${cx + 3},${tip - 5}`} className="fill-none" strokeWidth="1.2" />
            </g>
          );
        }
        return (
          <g key={b.filter} data-band={b.filter} className="stroke-ink-900">
            <title>{`${b.filter}: ${b.fluxNjy.toFixed(1)} ± ${b.errNjy.toFixed(1)} nJy`}</title>
            <line x1={cx} x2={cx} y1={y(b.fluxNjy - b.errNjy)} y2={y(b.fluxNjy + b.errNjy)} strokeWidth="1.2" />
            <circle cx={cx} cy={y(b.fluxNjy)} r="3" className="fill-ink-900" />
          </g>
        );
      })}
      <line x1={PAD.left} x2={W - PAD.right} y1={H - PAD.bottom} y2={H - PAD.bottom} className="stroke-ink-500" />
      <line x1={PAD.left} x2={PAD.left} y1={PAD.top} y2={H - PAD.bottom} className="stroke-ink-500" />
      {micronTicks.map((u) => (
        <text key={u} x={x(u * 1e4)} y={H - PAD.bottom + 13} textAnchor="middle" className="fill-ink-600 text-[10px]">
          {u}
        </text>
      ))}
      {fluxTicks.map((f) => (
        <text key={f} x={PAD.left - 4} y={y(f) + 3} textAnchor="end" className="fill-ink-600 text-[10px]">
          {f}
        </text>
      ))}
      <text x={(PAD.left + W - PAD.right) / 2} y={H - 3} textAnchor="middle" className="fill-ink-700 text-[10px]">
        observed wavelength (µm)
      </text>
      <text x={10} y={(H - PAD.bottom + PAD.top) / 2} textAnchor="middle" transform={`rotate(-90 10 ${(H - PAD.bottom + PAD.top) / 2})`} className="fill-ink-700 text-[10px]">
        f_ν (nJy)
      </text>
    </svg>
  );
}

/** About four round tick values over [lo, hi]. */
function niceTicks(lo: number, hi: number): number[] {
  const raw = (hi - lo) / 4;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * mag).find((s) => s >= raw) ?? raw;
  const out: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi; v += step) out.push(Number(v.toPrecision(6)));
  return out;
}
