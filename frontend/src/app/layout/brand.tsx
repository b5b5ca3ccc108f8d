import { Link } from 'react-router-dom';

/** The mark is a spectrum running from the blue end to the red end, with one bright line. */
export function Brand() {
  return (
    <Link to="/campaigns" className="flex items-center gap-2 rounded-control text-paper-50">
      <svg aria-hidden="true" viewBox="0 0 32 12" className="h-3 w-8">
        <defs>
          <linearGradient id="brand-band" x1="0" x2="1">
            <stop offset="0" stopColor="var(--color-blueend-400)" />
            <stop offset="1" stopColor="var(--color-ember-500)" />
          </linearGradient>
        </defs>
        <rect x="0" y="6" width="32" height="5" rx="1.5" fill="url(#brand-band)" />
        <rect x="21" y="0" width="2.5" height="11" rx="1" fill="var(--color-paper-100)" />
      </svg>
      <span className="text-md font-semibold tracking-wide">Redward</span>
    </Link>
  );
}
