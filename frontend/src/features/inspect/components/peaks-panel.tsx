import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { controlClass } from '@/components/ui/field';
import { formatRedshift } from '@/lib/format';
import type { CombLine, LineMatches } from '../api/schemas';

interface Props {
  lineMatches: LineMatches;
  lines: CombLine[];
  zMin: number;
  zMax: number;
  /** Peak index chosen on the plot (a click on its wedge), opened here for a line choice. */
  picked: number | null;
  onPick: (index: number | null) => void;
  onZ: (z: number) => void;
}

/**
 * The engine's second route: emission peaks it detected, pairs it matched, and the plain warning
 * when only one line is seen. A reader sets z by saying which line a peak is.
 */
export function PeaksPanel({ lineMatches, lines, zMin, zMax, picked, onPick, onZ }: Props) {
  const { peaks, matches, singleLine } = lineMatches;
  const emission = lines.filter((l) => l.kind === 'emission');
  return (
    <div className="flex flex-col gap-3">
      {singleLine ? (
        <div className="rounded-control border border-warning-700/30 bg-warning-100 px-3 py-2 text-sm text-warning-700">
          <p className="font-semibold">
            One significant line only, at <span className="num">{singleLine.wavelength.toFixed(1)} Å</span> (S/N {singleLine.snr.toFixed(0)}): the redshift is ambiguous.
          </p>
          <ul className="mt-1 flex flex-col gap-1">
            {singleLine.alternatives.map((a) => (
              <li key={a.line} className="flex flex-wrap items-baseline gap-x-2">
                <Button variant="quiet" size="sm" onClick={() => onZ(a.z)}>
                  <span className="sr-only">Try </span>
                  {a.line} → <span className="num">z = {formatRedshift(a.z)}</span>
                </Button>
                <span className="text-xs">tell-tale: {a.separator}</span>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {matches.length > 0 ? (
        <div>
          <h3 className="text-sm font-semibold text-ink-800">Line pairs found</h3>
          <ul className="mt-1 flex flex-col gap-1">
            {matches.map((m) => (
              <li key={m.z}>
                <Button variant="quiet" size="sm" onClick={() => onZ(m.z)}>
                  <span className="sr-only">Try line pair </span>
                  <span className="num">z = {formatRedshift(m.z)}</span>
                  <span className="text-xs text-ink-600">{m.lines.map((l) => l.name).join(' + ')}</span>
                </Button>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      <div>
        <h3 className="text-sm font-semibold text-ink-800">Detected peaks</h3>
        {peaks.length === 0 ? (
          <p className="text-sm text-ink-500">No significant emission peak.</p>
        ) : (
          <ul className="mt-1 flex flex-col gap-1">
            {peaks.map((p, i) => (
              <li key={p.wavelength}>
                {picked === i ? (
                  <PeakLineChooser wavelength={p.wavelength} lines={emission} zMin={zMin} zMax={zMax} onCancel={() => onPick(null)} onZ={(z) => (onZ(z), onPick(null))} />
                ) : (
                  <Button variant="quiet" size="sm" onClick={() => onPick(i)}>
                    <span className="sr-only">Peak at </span>
                    <span className="num">{p.wavelength.toFixed(1)} Å</span>
                    <span className="text-xs text-ink-600">S/N {p.snr.toFixed(1)}</span>
                    <span className="sr-only">: choose its line</span>
                  </Button>
                )}
              </li>
            ))}
          </ul>
        )}
      </div>
    </div>
  );
}

function PeakLineChooser({ wavelength, lines, zMin, zMax, onCancel, onZ }: { wavelength: number; lines: CombLine[]; zMin: number; zMax: number; onCancel: () => void; onZ: (z: number) => void }) {
  // Only lines that put this peak at a redshift the campaign allows.
  const options = lines.map((l) => ({ line: l, z: wavelength / l.rest - 1 })).filter((o) => o.z >= zMin && o.z <= zMax);
  const [choice, setChoice] = useState(options[0]?.line.name ?? '');
  const chosen = options.find((o) => o.line.name === choice);
  return (
    <form
      className="flex flex-wrap items-end gap-2 rounded-control border border-ember-400 bg-ember-50 p-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (chosen) onZ(chosen.z);
      }}
    >
      <div className="flex flex-col gap-1">
        <label htmlFor="peak-line" className="text-xs font-medium text-ink-800">
          Line at <span className="num">{wavelength.toFixed(1)} Å</span>
        </label>
        <select id="peak-line" autoFocus value={choice} onChange={(e) => setChoice(e.target.value)} className={`${controlClass} py-1 text-sm`}>
          {options.map((o) => (
            <option key={o.line.name} value={o.line.name}>
              {o.line.name} (z = {formatRedshift(o.z)})
            </option>
          ))}
        </select>
      </div>
      <Button type="submit" size="sm" disabled={!chosen}>
        Put this line on the peak
      </Button>
      <Button variant="quiet" size="sm" onClick={onCancel}>
        Cancel
      </Button>
    </form>
  );
}
