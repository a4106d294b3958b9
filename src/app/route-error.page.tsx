import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import { isApiError } from '../lib/api-client';
import { errorText } from '../lib/error-text';
import { useDocumentTitle } from '../lib/document-title';

/** What went wrong, in the interface language. */
function useScreenErrorText(error: unknown): string {
  const { t } = useTranslation('app');
  if (isApiError(error)) return errorText(error);
  if (isRouteErrorResponse(error)) return `${error.status} ${error.statusText}`;
  return t('routeError.generic');
}

/** The last resort of the router: a loader or a screen failed in a way nothing else caught. */
export function RouteErrorPage({ error: given }: { error?: unknown } = {}) {
  const { t } = useTranslation('app');
  const routeError = useRouteError();
  const message = useScreenErrorText(given ?? routeError);
  useDocumentTitle(t('routeError.title'));
  return (
    <main id="main" className="mx-auto max-w-prose p-6">
      <p className="text-lg font-bold text-accent-900">Broodcast</p>
      <h1 className="mt-6 text-2xl font-bold">{t('routeError.title')}</h1>
      <p className="mt-3">{message}</p>
      <p className="mt-6">
        <button type="button" className="btn btn-primary" onClick={() => window.location.reload()}>
          {t('routeError.retry')}
        </button>
      </p>
    </main>
  );
}

export function LoadingScreen() {
  const { t } = useTranslation();
  return (
    <main id="main" className="mx-auto max-w-prose p-6" aria-busy="true">
      <p className="text-lg font-bold text-accent-900">Broodcast</p>
      <p className="mt-6">{t('loading')}</p>
    </main>
  );
}

/** A screen failed inside the signed-in layout: the header and navigation stay usable. */
export function ScreenErrorPage() {
  const { t } = useTranslation('app');
  const error = useRouteError();
  console.error(error);
  const message = useScreenErrorText(error);
  useDocumentTitle(t('routeError.title'));
  return (
    <section aria-labelledby="page-title" className="max-w-prose">
      <h1 id="page-title" className="text-2xl font-bold">
        {t('routeError.title')}
      </h1>
      <p className="mt-3">{message}</p>
      <p className="mt-6">
        <button type="button" className="btn btn-primary" onClick={() => window.location.reload()}>
          {t('routeError.retry')}
        </button>
      </p>
    </section>
  );
}
