// What a page shows when it fails to load: a plain explanation and a way forward, never a stack trace.
import { Link, isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { ApiError } from '../../lib/api-client';
import { buttonClass } from '../../components/ui/button';

export function RouteError() {
  const err = useRouteError();
  let title = 'Something went wrong';
  let message = 'The page could not be shown. Try again; if it keeps happening, tell your coach or the team admin.';
  if (isRouteErrorResponse(err) && err.status === 404) {
    title = 'Page not found';
    message = 'There is no page at this address.';
  } else if (err instanceof ApiError) {
    if (err.status === 404) title = 'Not found';
    message = err.message;
  }
  return (
    <main className="mx-auto max-w-xl p-6">
      <h1 className="text-2xl font-bold">{title}</h1>
      <p className="mt-2 text-ink-700">{message}</p>
      <div className="mt-4 flex gap-2">
        <button type="button" className={buttonClass('primary')} onClick={() => window.location.reload()}>
          Try again
        </button>
        <Link to="/" className={buttonClass('secondary')}>
          Go to my start page
        </Link>
      </div>
    </main>
  );
}
