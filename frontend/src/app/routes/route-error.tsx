import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { Page } from '@/components/layout/page';
import { ErrorNotice } from '@/components/ui/notice';
import { NotFoundRoute } from './not-found';

/** Last line of defence for a page that failed to render: say so, and offer a way out. */
export function RouteError() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFoundRoute />;
  return (
    <Page title="This page failed to load">
      <ErrorNotice error={error} />
      <p>
        <Link to="/campaigns" className="text-blueend-700 underline underline-offset-2" reloadDocument>
          Back to campaigns
        </Link>
      </p>
    </Page>
  );
}
