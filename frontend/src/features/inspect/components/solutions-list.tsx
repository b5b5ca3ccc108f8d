import { Badge } from '@/components/ui/badge';
import { formatRedshift, formatRedshiftError } from '@/lib/format';
import type { DetailTarget, Solution } from '../api/schemas';
import { useTrialZDerived } from '../hooks/use-trial-z';
import { photoZAgreement } from '../utils/photo-z';
import type { TrialZStore } from '@/components/spectrum/trial-z-store';
import { asSpectrumClass, CLASS_NAMES } from '@/lib/spectrum-class';

interface Props {
  solutions: Solution[];
  /** The comb; the solution it sits on is highlighted. */
  store: TrialZStore;
  target: DetailTarget | null;
  onSnap: (index: number) => void;
}

const MAX_LINES_SHOWN = 6;

/** The engine's ranked solutions; pressing one snaps the comb (and the class) to it. */
export function SolutionsList({ solutions, store, target, onSnap }: Props) {
  const current = useTrialZDerived(store, (z) => solutions.findIndex((s) => s.z === z));
  if (solutions.length === 0) return <p className="text-ink-500">The scan proposed no solution.</p>;
  return (
    <ol className="flex flex-col gap-1.5" aria-label="Solutions">
      {solutions.map((s, i) => {
        const cls = CLASS_NAMES[asSpectrumClass(s.class)];
        // The catalogue's typed photo-z range when it has one, else the one computed from its fluxes.
        const typed = target?.photoZLow != null && target.photoZHigh != null;
        const agreement = typed ? photoZAgreement(s.z, target.photoZLow, target.photoZHigh) : photoZAgreement(s.z, target?.photoZFit?.z68[0], target?.photoZFit?.z68[1]);
        const lines = s.lines.map((l) => l.name);
        return (
          <li key={`${s.template}-${s.z}`}>
            <button
              type="button"
              onClick={() => onSnap(i)}
              aria-current={current === i ? 'true' : undefined}
              className={`w-full rounded-control border px-2.5 py-1.5 text-left transition-colors ${
                current === i ? 'border-ember-500 bg-ember-50' : 'border-paper-300 bg-paper-50 hover:bg-paper-200'
              }`}
            >
              <span className="flex flex-wrap items-baseline gap-x-3 gap-y-0.5">
                {/* The name read out is the visible text with "Solution n:" in front (axe: label-content-name-mismatch). */}
                <span className="num text-xs text-ink-500">
                  <span className="sr-only">Solution </span>
                  {i + 1}
                  <span className="sr-only">:</span>
                </span>
                <span className="num font-medium text-ink-900">
                  z = {formatRedshift(s.z)} <span className="text-ink-500">± {formatRedshiftError(s.zErr)}</span>
                  {s.zSysErr !== undefined ? (
                    <span className="text-ink-500" title="Systematic error: the lines that set this class's redshift sit off the systemic redshift by amounts that vary from object to object (Lyα and interstellar lines of Lyman-break galaxies, blueshifted high-ionisation lines of quasars)">
                      {' '}± {formatRedshiftError(s.zSysErr)} sys
                    </span>
                  ) : null}
                </span>
                <Badge tone={s.class === 'quasar' ? 'blue' : s.class === 'galaxy' ? 'ember' : s.class === 'lyman-break' ? 'success' : 'ink'}>{cls}</Badge>
                <span className="text-xs text-ink-600">{s.template}</span>
                <span className="num text-xs text-ink-600" title="χ² of the next distinct solution minus this one's">
                  Δχ² {s.deltaChi2 === null ? '—' : Math.round(s.deltaChi2).toLocaleString('en')}
                </span>
                {s.reducedChi2 !== undefined ? (
                  <span className="num text-xs text-ink-600" title="χ² per degree of freedom of this fit; above 1 the error shown is scaled by its square root">
                    χ²/dof {s.reducedChi2 < 100 ? s.reducedChi2.toFixed(2) : Math.round(s.reducedChi2).toLocaleString('en')}
                  </span>
                ) : null}
                {agreement !== 'unknown' ? (
                  <span className={`text-xs ${agreement === 'inside' ? 'text-success-700' : 'text-warning-700'}`}>
                    {agreement === 'inside' ? 'inside' : 'outside'} photo-z 68 %
                  </span>
                ) : null}
              </span>
              {s.singleFeaturePenalty && s.featureShare !== undefined ? (
                <span className="mt-0.5 block text-xs text-warning-700" title="The χ² gain of this fit comes almost entirely from one 0.006 dex window; its evidence was capped and the solution ranked lower.">
                  One feature carries {Math.round(100 * s.featureShare)} % of the evidence: demoted
                </span>
              ) : null}
              {s.forestChi2 ? (
                <span className="mt-0.5 block text-xs text-warning-700" title="Between Lyβ and Lyα the spectrum is as smooth as a continuum, where a source at this redshift shows a ragged Lyα forest: χ² added to this solution.">
                  Lyα forest too smooth for this z: χ² + <span className="num">{Math.round(s.forestChi2).toLocaleString('en')}</span>
                </span>
              ) : null}
              {s.interlopers && s.interlopers.length > 0 ? <InterloperLine interlopers={s.interlopers} /> : null}
              {lines.length > 0 ? (
                <span className="mt-0.5 block text-xs text-ink-600">
                  {lines.slice(0, MAX_LINES_SHOWN).join(' · ')}
                  {lines.length > MAX_LINES_SHOWN ? ` · +${lines.length - MAX_LINES_SHOWN} more` : ''}
                </span>
              ) : null}
            </button>
          </li>
        );
      })}
    </ol>
  );
}

/**
 * The interloper question beside a Lyman-break solution: how much worse each low-redshift or
 * stellar alternative fits (Δχ² > 0 favours the Lyman break; ≤ 0 means the alternative fits as well
 * or better and is flagged).
 */
function InterloperLine({ interlopers }: { interlopers: NonNullable<Solution['interlopers']> }) {
  return (
    <span className="mt-0.5 block text-xs text-ink-600" title="χ² of the alternative minus χ² of this solution, with the same continuum-shape and single-feature checks; positive favours the Lyman break">
      {interlopers.map((a, k) => (
        <span key={a.kind} className={a.deltaChi2 <= 0 ? 'text-warning-700' : undefined}>
          {k > 0 ? ' · ' : ''}
          {a.label}: Δχ² = <span className="num">{Math.round(a.deltaChi2).toLocaleString('en')}</span>
        </span>
      ))}
    </span>
  );
}
