import { useCallback, useState } from 'react';
import type { Dispatch, SetStateAction } from 'react';

/**
 * State that belongs to one spectrum: made by `init` when the spectrum on screen changes, kept while
 * it stays. The workspace stays mounted from one spectrum to the next (its plots keep their
 * canvases, which are costly to make), so what a reader did on one spectrum — the comb, the draft
 * reading, a picked peak — must not follow them to the next. During the render that sees a new
 * spectrum the fresh value is returned at once and stored (React renders again straight away).
 */
export function usePerSpectrum<T>(spectrumId: number, init: () => T): [T, Dispatch<SetStateAction<T>>] {
  const [state, setState] = useState(() => ({ spectrumId, value: init() }));
  const set = useCallback<Dispatch<SetStateAction<T>>>(
    (update) => setState((s) => ({ spectrumId: s.spectrumId, value: typeof update === 'function' ? (update as (prev: T) => T)(s.value) : update })),
    [],
  );
  if (state.spectrumId !== spectrumId) {
    const fresh = { spectrumId, value: init() };
    setState(fresh);
    return [fresh.value, set];
  }
  return [state.value, set];
}
