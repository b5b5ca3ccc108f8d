import { SPECTRUM_CLASSES } from '@contracts/readings';
import { useSearchParams } from 'react-router-dom';
import { z } from 'zod';

/** The table's page and filters, kept in the URL so a filtered view can be shared with a collaborator. */
const filtersSchema = z.object({
  page: z.coerce.number().int().min(1).catch(1),
  pageSize: z.coerce.number().int().min(1).max(1000).catch(50),
  grade: z.string().trim().min(1).max(16).optional().catch(undefined),
  class: z.enum(SPECTRUM_CLASSES).optional().catch(undefined),
  family: z.string().trim().max(80).optional().catch(undefined),
  confirmedBy: z.enum(['agreement', 'settlement', 'correction']).optional().catch(undefined),
});
export type ConfirmedFilters = z.output<typeof filtersSchema>;

const KEYS = ['page', 'pageSize', 'grade', 'class', 'family', 'confirmedBy'] as const;
const DEFAULTS: Partial<Record<(typeof KEYS)[number], unknown>> = { page: 1, pageSize: 50 };

export function useConfirmedQuery() {
  const [params, setParams] = useSearchParams();
  const raw: Record<string, string> = {};
  for (const key of KEYS) {
    const v = params.get(key);
    if (v !== null && v !== '') raw[key] = v;
  }
  const query = filtersSchema.parse(raw);

  /** A filter change starts again at page 1; a page move keeps the filters. */
  const update = (patch: Partial<ConfirmedFilters>) => {
    const next: ConfirmedFilters = { ...query, ...patch, ...('page' in patch ? {} : { page: 1 }) };
    setParams((current) => {
      const out = new URLSearchParams(current);
      for (const key of KEYS) {
        const v = next[key];
        if (v === undefined || v === '' || v === DEFAULTS[key]) out.delete(key);
        else out.set(key, String(v));
      }
      return out;
    });
  };
  return { query, update };
}

/** The same filters as a query string for the API (downloads use it too, without the paging). */
export function confirmedSearch(query: Partial<ConfirmedFilters>, format: string): string {
  const p = new URLSearchParams({ format });
  for (const key of KEYS) {
    const v = query[key];
    if (v !== undefined && v !== '') p.set(key, String(v));
  }
  return p.toString();
}
