import { useEffect, type ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { useSearchParams } from 'react-router-dom';
import { isLanguage } from '../../../../shared/languages';
import { setLanguage } from '../../../i18n';
import { LanguagePicker } from '../../../components/language-picker';
import { useDocumentTitle } from '../../../lib/document-title';

/** The frame of the screens used without a session: sign-in, password reset, invitation, unsubscribe. */
export function AuthShell({ title, children }: { title: string; children: ReactNode }) {
  const { t } = useTranslation('auth');
  useDocumentTitle(title);
  useLinkLanguage();
  return (
    <div className="min-h-dvh bg-paper px-4 py-10 sm:py-16">
      <main id="main" className="mx-auto w-full max-w-md">
        <div className="flex flex-wrap items-start justify-between gap-3">
          <div>
            <p className="brand text-2xl">Broodcast</p>
            <p className="mt-1 text-sm text-ink-muted">{t('shell.tagline')}</p>
          </div>
          <LanguagePicker />
        </div>
        <section aria-labelledby="page-title" className="card mt-6">
          <h1 id="page-title" className="text-xl font-bold text-ink">
            {title}
          </h1>
          <div className="mt-4">{children}</div>
        </section>
      </main>
    </div>
  );
}

/**
 * A mailed link (invitation, password reset) names the language its mail was written in (`?lang=fr`):
 * the page opens in that language, whatever this device chose before. The picker still changes it.
 */
function useLinkLanguage() {
  const [params] = useSearchParams();
  const lang = params.get('lang');
  useEffect(() => {
    if (isLanguage(lang)) void setLanguage(lang);
  }, [lang]);
}
