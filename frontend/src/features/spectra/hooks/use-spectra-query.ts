import { spectraQuerySchema } from '@contracts/ingest';
import type { z } from 'zod';
import { useSearchParams } from 'react-router-dom';

export type SpectraQueryState = z.output<typeof spectraQuerySchema>;

const KEYS = Object.keys(spectraQuerySchema.shape) as (keyof SpectraQueryState)[];
const DEFAULTS = spectraQuerySchema.parse({});

/**
 * The list's sort, filters and page live in the URL, so a view can be bookmarked, shared
 * with a collaborator, and restored by the back button. A malformed parameter is ignored.
 */
export function useSpectraQuery() {
  const [params, setParams] = useSearchParams();

  const raw: Record<string, string> = {};
  for (const key of KEYS) {
    const value = params.get(key);
    if (value !== null && spectraQuerySchema.shape[key].safeParse(value).success) raw[key] = value;
  }
  const query = spectraQuerySchema.parse(raw);

  /** Any change other than the page itself starts again at page 1. */
  const update = (patch: Partial<SpectraQueryState>, { replace = false } = {}) => {
    const next: SpectraQueryState = { ...query, ...patch, ...('page' in patch ? {} : { page: 1 }) };
    setParams(
      (current) => {
        const out = new URLSearchParams(current);
        for (const key of KEYS) {
          const value = next[key];
          if (value === undefined || value === '' || value === DEFAULTS[key]) out.delete(key);
          else out.set(key, String(value));
        }
        return out;
      },
      { replace },
    );
  };

  return { query, update };
}
