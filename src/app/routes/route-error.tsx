import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { Wordmark } from '../../components/ui/logo-mark';
import { errorMessage } from '../../lib/api-client';

/** Shown when a page fails to load or throws while rendering (e.g. an outdated chunk after a new release). */
export function RouteError() {
  const error = useRouteError();
  const message = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : errorMessage(error);
  return (
    <div className="mx-auto flex min-h-screen max-w-form flex-col justify-center gap-4 px-gutter">
      <Wordmark />
      <h1>This page stopped working</h1>
      <p className="text-hull-700">{message}</p>
      <p className="text-small text-hull-600">
        Reload the page. If it happens again, note what you did and tell your administrator.
      </p>
      <div>
        <Button onClick={() => window.location.reload()}>Reload</Button>
      </div>
    </div>
  );
}
