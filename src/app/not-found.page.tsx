import { Link } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import { PageHeading } from '../components/page-heading';

export function NotFoundPage() {
  const { t } = useTranslation('app');
  return (
    <section aria-labelledby="page-title" className="max-w-prose">
      <PageHeading>{t('notFound.title')}</PageHeading>
      <p className="mt-3">{t('notFound.body')}</p>
      <p className="mt-4">
        <Link to="/" className="link">
          {t('backToLadder')}
        </Link>
      </p>
    </section>
  );
}
