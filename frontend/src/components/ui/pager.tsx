import { Button } from './button';
import { SelectField } from './field';

interface PagerProps {
  /** 1-based. */
  page: number;
  pageCount: number;
  pageSize: number;
  pageSizes: readonly number[];
  onPage: (page: number) => void;
  onPageSize: (size: number) => void;
}

/** Page controls for server-paged tables; the position is announced as it changes. */
export function Pager({ page, pageCount, pageSize, pageSizes, onPage, onPageSize }: PagerProps) {
  const last = Math.max(1, pageCount);
  return (
    <nav aria-label="Pages" className="flex flex-wrap items-end justify-between gap-3">
      <SelectField label="Page size" value={pageSize} onChange={(e) => onPageSize(Number(e.target.value))} fieldClassName="w-24" className="num">
        {pageSizes.map((n) => (
          <option key={n} value={n}>
            {n}
          </option>
        ))}
      </SelectField>
      <div className="flex items-center gap-2">
        <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => onPage(1)}>
          First
        </Button>
        <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => onPage(page - 1)}>
          Previous
        </Button>
        <p aria-live="polite" className="px-1 text-sm text-ink-700">
          Page <span className="num">{page}</span> of <span className="num">{last}</span>
        </p>
        <Button variant="secondary" size="sm" disabled={page >= last} onClick={() => onPage(page + 1)}>
          Next
        </Button>
        <Button variant="secondary" size="sm" disabled={page >= last} onClick={() => onPage(last)}>
          Last
        </Button>
      </div>
    </nav>
  );
}
