import { buttonClass } from '@/components/ui/button';
import { confirmedSearch } from '../hooks/use-confirmed-query';
import type { ConfirmedFilters } from '../hooks/use-confirmed-query';

const FORMATS = [
  { format: 'csv', label: 'Download CSV', hint: 'commented header' },
  { format: 'ecsv', label: 'Download ECSV', hint: 'astropy Table.read' },
  { format: 'votable', label: 'Download VOTable', hint: 'IVOA 1.4' },
  { format: 'fits', label: 'Download FITS', hint: 'binary table' },
] as const;

/**
 * Plain links: the server names the file and the browser saves it, so large tables stream
 * without passing through JavaScript. The current filters apply; paging does not.
 */
export function Downloads({ campaignId, query }: { campaignId: number; query: ConfirmedFilters }) {
  const filters = { grade: query.grade, class: query.class, family: query.family, confirmedBy: query.confirmedBy };
  return (
    <ul aria-label="Downloads" className="flex flex-wrap gap-2">
      {FORMATS.map((f) => (
        <li key={f.format}>
          <a href={`/api/campaigns/${campaignId}/confirmed?${confirmedSearch(filters, f.format)}`} download className={buttonClass('secondary', 'sm')} title={f.hint}>
            {f.label}
          </a>
        </li>
      ))}
    </ul>
  );
}
