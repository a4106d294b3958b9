import { useEffect } from 'react';
import { useTranslation } from 'react-i18next';

/**
 * Names the browser tab after the screen ("Users · Broodcast", in the interface language) and keeps
 * `<html lang>` on the interface language, so screen readers pronounce the page right (WCAG 2.4.2, 3.1.1).
 */
export function useDocumentTitle(title: string | null | undefined): void {
  const { t, i18n } = useTranslation('app');
  const full = title ? t('documentTitle', { page: title }) : t('common:appName');
  useEffect(() => {
    if (typeof document === 'undefined') return;
    document.title = full;
    document.documentElement.lang = i18n.resolvedLanguage ?? i18n.language;
  }, [full, i18n.resolvedLanguage, i18n.language]);
}
