import { useSyncExternalStore } from 'react';
import { useTranslation } from 'react-i18next';

function subscribe(onChange: () => void) {
  window.addEventListener('online', onChange);
  window.addEventListener('offline', onChange);
  return () => {
    window.removeEventListener('online', onChange);
    window.removeEventListener('offline', onChange);
  };
}
const isOnline = () => navigator.onLine;
// On the server side of a render (none today) a page is taken as online.
const onlineOnServer = () => true;

/** Whether the browser says it has a network (navigator.onLine, kept current by the online/offline events). */
export function useOnline(): boolean {
  return useSyncExternalStore(subscribe, isOnline, onlineOnServer);
}

/**
 * A banner under the header while the device is offline: what is shown is what this device last loaded,
 * and a survey saved now waits on the device. `navigator.onLine` false is reliable (no network at all);
 * true only means a network exists, which is why the survey outbox still retries on its own.
 */
export function OfflineBanner() {
  const { t } = useTranslation('components');
  const online = useOnline();
  if (online) return null;
  return (
    <div role="status" className="offline-banner" data-testid="offline-banner">
      <p className="mx-auto w-full max-w-6xl px-4 py-2 text-sm sm:px-6">
        <strong>{t('offline.title')}</strong> {t('offline.body')}
      </p>
    </div>
  );
}
