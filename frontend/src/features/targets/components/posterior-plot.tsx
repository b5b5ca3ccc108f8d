import type { PhotoZSummary } from '@contracts/targets';

const W = 420;
const H = 150;
const PAD = { left: 34, right: 10, top: 10, bottom: 28 };
const Z_MAX = 12;

const x = (z: number) => PAD.left + ((W - PAD.left - PAD.right) * z) / Z_MAX;

/**
 * P(z) of a target as an SVG: the density (scaled to its peak), the 95 % interval shaded, the
 * 68 % interval darker, the best z marked, and z < 2 (where the interloper odds are counted) hatched.
 */
export function PosteriorPlot({ posterior, fit, label }: { posterior: { z: number[]; p: number[] }; fit: PhotoZSummary; label: string }) {
  const peak = Math.max(...posterior.p, 1e-300);
  const y = (p: number) => H - PAD.bottom - ((H - PAD.top - PAD.bottom) * p) / peak;
  const line = posterior.z.map((z, i) => `${i === 0 ? 'M' : 'L'}${x(z).toFixed(1)},${y(posterior.p[i]!).toFixed(1)}`).join('');
  const area = `${line}L${x(posterior.z[posterior.z.length - 1]!).toFixed(1)},${y(0)}L${x(0)},${y(0)}Z`;
  const band = (lo: number, hi: number) => ({ x: x(lo), width: Math.max(1, x(hi) - x(lo)) });
  const b95 = band(fit.z95[0], fit.z95[1]);
  const b68 = band(fit.z68[0], fit.z68[1]);
  const ticks = [0, 2, 4, 6, 8, 10, 12];
  return (
    <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={label} className="w-full max-w-xl">
      <title>{label}</title>
      <defs>
        <pattern id="lowz-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <line x1="0" y1="0" x2="0" y2="6" className="stroke-paper-300" strokeWidth="2" />
        </pattern>
      </defs>
      <rect x={x(0)} y={PAD.top} width={x(2) - x(0)} height={H - PAD.top - PAD.bottom} fill="url(#lowz-hatch)" />
      <rect x={b95.x} y={PAD.top} width={b95.width} height={H - PAD.top - PAD.bottom} className="fill-ember-50" />
      <rect x={b68.x} y={PAD.top} width={b68.width} height={H - PAD.top - PAD.bottom} className="fill-ember-100" />
      <path d={area} className="fill-ember-400/40" />
      <path d={line} className="fill-none stroke-ember-700" strokeWidth="1.2" />
      <line x1={x(fit.z)} x2={x(fit.z)} y1={PAD.top} y2={H - PAD.bottom} className="stroke-ink-900" strokeDasharray="3 2" />
      <line x1={PAD.left} x2={W - PAD.right} y1={H - PAD.bottom} y2={H - PAD.bottom} className="stroke-ink-500" />
      {ticks.map((t) => (
        <g key={t}>
          <line x1={x(t)} x2={x(t)} y1={H - PAD.bottom} y2={H - PAD.bottom + 4} className="stroke-ink-500" />
          <text x={x(t)} y={H - PAD.bottom + 15} textAnchor="middle" className="fill-ink-600 text-[10px]">
            {t}
          </text>
        </g>
      ))}
      <text x={(PAD.left + W - PAD.right) / 2} y={H - 2} textAnchor="middle" className="fill-ink-700 text-[10px]">
        redshift z
      </text>
      <text x={x(1)} y={PAD.top + 10} textAnchor="middle" className="fill-ink-600 text-[9px]">
        z &lt; 2
      </text>
      <text x={12} y={(H - PAD.bottom + PAD.top) / 2} textAnchor="middle" transform={`rotate(-90 12 ${(H - PAD.bottom + PAD.top) / 2})`} className="fill-ink-700 text-[10px]">
        P(z)
      </text>
    </svg>
  );
}
