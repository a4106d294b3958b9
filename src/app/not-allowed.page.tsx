import { Link } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import { PageHeading } from '../components/page-heading';

/** Shown, inside the layout, for a screen the signed-in role may not use (and for any 403). */
export function NotAllowedPage() {
  const { t } = useTranslation('app');
  return (
    <section aria-labelledby="page-title" className="max-w-prose">
      <PageHeading>{t('notAllowed.title')}</PageHeading>
      <p className="mt-3">{t('notAllowed.body')}</p>
      <p className="mt-4">
        <Link to="/" className="link">
          {t('backToLadder')}
        </Link>
      </p>
    </section>
  );
}
