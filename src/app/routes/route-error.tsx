import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { Button } from '../../components/ui/button.tsx';
import { DocumentTitle } from '../../components/ui/document-title.tsx';
import { EmptyState } from '../../components/ui/empty-state.tsx';
import { ErrorState } from '../../components/ui/error-state.tsx';
import { env } from '../../config/env.ts';
import { paths } from '../../config/paths.ts';

/** The error boundary of a route section: says what failed and offers a way on. */
export function RouteError() {
  const error = useRouteError();
  // Keep the stack where a developer looks for it; the page shows a plain message instead.
  if (env.isDev) console.error(error);
  if (isRouteErrorResponse(error) && error.status === 404) {
    return (
      <EmptyState headingLevel={1} title="Page not found" action={<Link to={paths.overview.getHref()}>Go to the overview</Link>} className="m-6">
        <DocumentTitle title="Page not found" />
        There is no page at this address.
      </EmptyState>
    );
  }
  return (
    <div className="m-6 flex flex-col items-start gap-4">
      <DocumentTitle title="Something went wrong" />
      <h1 className="text-2xl font-bold">Something went wrong</h1>
      <ErrorState error={error} title="This page stopped working" />
      <Button variant="secondary" onClick={() => window.location.reload()}>
        Reload the page
      </Button>
    </div>
  );
}
