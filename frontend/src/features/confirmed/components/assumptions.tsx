import type { ConfirmedPage } from '@contracts/release';
import { formatTolerance } from '@/lib/format';

/** What every value in the table (and in each download's header) rests on, said plainly. */
export function Assumptions({ assumptions: a }: { assumptions: ConfirmedPage['assumptions'] }) {
  const c = a.cosmology;
  return (
    <dl aria-label="Assumptions" className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
      <dt className="text-ink-500">Wavelengths</dt>
      <dd>{a.wavelengths} (air wavelengths in a file were converted before the search)</dd>
      <dt className="text-ink-500">Cosmology</dt>
      <dd>
        {c.name}: <span className="num">H₀ = {c.h0} km s⁻¹ Mpc⁻¹, Ωm = {c.omegaM}, ΩΛ = {c.omegaLambda}</span>, flat
      </dd>
      <dt className="text-ink-500">Agreement tolerance</dt>
      <dd className="num">{formatTolerance(a.tolerance)}</dd>
    </dl>
  );
}
