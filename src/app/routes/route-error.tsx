import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { ErrorState } from '../../components/ui/error-state';
import { PageColumn } from '../layout';

/**
 * The error boundary of every route (`errorElement`): a crash in one page shows here, in place,
 * with a way back, instead of a blank screen.
 */
export function RouteError() {
  const error = useRouteError();
  const notFound = isRouteErrorResponse(error) && error.status === 404;
  const shown = isRouteErrorResponse(error) ? new Error(error.statusText || `Error ${error.status}`) : error;
  return (
    <div className="mat-grid flex h-full flex-col">
      <PageColumn width="narrow">
        <div className="flex flex-col items-center gap-4">
          <ErrorState error={shown} title={notFound ? 'Page not found' : 'This page failed to load'} onRetry={notFound ? undefined : () => window.location.reload()} />
          <Link to="/boards" className="text-sm text-amber-300 hover:underline">
            Go to your boards
          </Link>
        </div>
      </PageColumn>
    </div>
  );
}

/** Any address the app does not know. */
export function NotFoundPage() {
  return (
    <PageColumn width="narrow">
      <div className="flex flex-col items-center gap-4">
        <ErrorState error={new Error('There is no page at this address.')} title="Page not found" />
        <Link to="/boards" className="text-sm text-amber-300 hover:underline">
          Go to your boards
        </Link>
      </div>
    </PageColumn>
  );
}
