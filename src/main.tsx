import { StrictMode, Suspense } from 'react';
import { createRoot } from 'react-dom/client';
import { QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router-dom';
import { I18nextProvider } from 'react-i18next';
import { i18n } from './i18n';
import { queryClient } from './app/query-client';
import { createAppRouter } from './app/router';
import './styles.css';
import { startOfflineSupport } from './pwa/register';

startOfflineSupport(queryClient);
const router = createAppRouter();

/** While the first texts of the user's language arrive (src/i18n): no words yet, so none to translate. */
const starting = (
  <main id="main" className="mx-auto max-w-prose p-6" aria-busy="true">
    <p className="text-lg font-bold text-accent-900">Broodcast</p>
  </main>
);

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <I18nextProvider i18n={i18n}>
      <QueryClientProvider client={queryClient}>
        <Suspense fallback={starting}>
          <RouterProvider router={router} />
        </Suspense>
      </QueryClientProvider>
    </I18nextProvider>
  </StrictMode>,
);
