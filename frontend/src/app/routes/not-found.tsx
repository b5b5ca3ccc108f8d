import { Link } from 'react-router-dom';
import { Page } from '@/components/layout/page';

export function NotFoundRoute() {
  return (
    <Page title="Page not found">
      <p className="text-ink-700">Nothing lives at this address. It may have been mistyped, or the link may be out of date.</p>
      <p>
        <Link to="/campaigns" className="text-blueend-700 underline underline-offset-2">
          Go to your campaigns
        </Link>
      </p>
    </Page>
  );
}
