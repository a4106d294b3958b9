import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { isApiError } from '../lib/api-client';

/** The last resort of the router: a loader or a screen failed in a way nothing else caught. */
export function RouteErrorPage({ error: given }: { error?: unknown } = {}) {
  const routeError = useRouteError();
  const error = given ?? routeError;
  const message = isApiError(error)
    ? error.message
    : isRouteErrorResponse(error)
      ? `${error.status} ${error.statusText}`
      : 'Something went wrong while showing this screen.';
  return (
    <main id="main" className="mx-auto max-w-prose p-6">
      <p className="text-lg font-bold text-accent-900">Broodcast</p>
      <h1 className="mt-6 text-2xl font-bold">This screen could not be shown</h1>
      <p className="mt-3">{message}</p>
      <p className="mt-6">
        <button type="button" className="btn btn-primary" onClick={() => window.location.reload()}>
          Try again
        </button>
      </p>
    </main>
  );
}

export function LoadingScreen() {
  return (
    <main id="main" className="mx-auto max-w-prose p-6" aria-busy="true">
      <p className="text-lg font-bold text-accent-900">Broodcast</p>
      <p className="mt-6">Loading…</p>
    </main>
  );
}

/** A screen failed inside the signed-in layout: the header and navigation stay usable. */
export function ScreenErrorPage() {
  const error = useRouteError();
  console.error(error);
  return (
    <section aria-labelledby="page-title" className="max-w-prose">
      <h1 id="page-title" className="text-2xl font-bold">
        This screen could not be shown
      </h1>
      <p className="mt-3">{isApiError(error) ? error.message : 'Something went wrong while showing this screen.'}</p>
      <p className="mt-6">
        <button type="button" className="btn btn-primary" onClick={() => window.location.reload()}>
          Try again
        </button>
      </p>
    </section>
  );
}
