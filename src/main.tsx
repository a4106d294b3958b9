import { StrictMode } from 'react';
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

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <I18nextProvider i18n={i18n}>
      <QueryClientProvider client={queryClient}>
        <RouterProvider router={router} />
      </QueryClientProvider>
    </I18nextProvider>
  </StrictMode>,
);
