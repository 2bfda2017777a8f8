import { Link, isRouteErrorResponse, useRouteError } from 'react-router';
import { isApiError } from '../../lib/api';
import { Button } from '../ui/button';
import { describeError } from './describe-error';
import { NotFoundPage } from './not-found-page';

/** Used as a route errorElement: inside the frame it keeps the navigation, at the root it fills the page. */
export function RouteError() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFoundPage />;
  const { title, explanation, nextStep } = describeError(error);
  return (
    <div role="alert" className="max-w-2xl space-y-2 text-sm">
      <h1 className="text-2xl font-bold">{title}</h1>
      <p>{explanation}</p>
      <p className="text-ink/75">{nextStep}</p>
      <div className="flex gap-3 pt-1">
        <Button onClick={() => window.location.reload()}>Reload the page</Button>
        {isApiError(error) && error.status === 401 ? (
          <Link className="self-center font-medium underline" to="/signin">
            Sign in again
          </Link>
        ) : (
          <Link className="self-center font-medium underline" to="/">
            Go to the floor
          </Link>
        )}
      </div>
    </div>
  );
}

export function RootRouteError() {
  return (
    <main className="min-h-screen bg-paper p-8 text-ink">
      <RouteError />
    </main>
  );
}
