import { Button } from './button';
import { EmptyState } from './empty-state';

/** Shown when a shared link or a shrinking result leaves the page number beyond the last page. */
export function PastLastPage({ page, onFirstPage }: { page: number; onFirstPage: () => void }) {
  return (
    <EmptyState title={`Page ${page} is past the end of the table.`}>
      <Button variant="secondary" size="sm" onClick={onFirstPage}>
        Go to page 1
      </Button>
    </EmptyState>
  );
}
