import type { CatalogueRowError } from '@contracts/targets';
import { formatCount } from '@/lib/format';

const SHOWN = 50;

/** Row problems by line number as the file shows it (header = line 1), so they can be fixed in an editor. */
export function RowErrors({ errors }: { errors: CatalogueRowError[] }) {
  if (errors.length === 0) return null;
  return (
    <section aria-labelledby="row-errors-heading" className="rounded-control border border-danger-600/40 bg-danger-100 px-3 py-2 text-danger-700">
      <h3 id="row-errors-heading" className="font-semibold">
        <span className="num">{formatCount(errors.length)}</span> {errors.length === 1 ? 'problem' : 'problems'} in the catalogue; nothing is imported until they are fixed
      </h3>
      <ul className="mt-1 max-h-64 overflow-y-auto">
        {errors.slice(0, SHOWN).map((e, i) => (
          <li key={`${e.line}-${e.column ?? ''}-${i}`}>
            <span className="num">Line {e.line}</span>
            {e.column ? <span className="num"> ({e.column})</span> : null}: {e.message}
          </li>
        ))}
      </ul>
      {errors.length > SHOWN ? <p className="mt-1 text-sm">The first {SHOWN} are listed.</p> : null}
    </section>
  );
}
