import { useTranslation } from 'react-i18next';
import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useFlags } from './api/flags.api';
import { DecisionForm } from './components/decision.form';
import { FlagSummary } from './components/flag-summary';
import { errorText } from '../../lib/error-text';

/** The sign-off queue (supervisor): open flags, highest tier first, then newest; decide each in place. */
export function SignOffPage() {
  const { t } = useTranslation('flags');
  const flags = useFlags('open');
  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={t('signOff.lead')}>{t('signOff.title')}</PageHeading>
      {flags.isPending ? (
        <p className="text-ink-muted">{t('signOff.loading')}</p>
      ) : flags.isError ? (
        <FormMessage kind="error">{errorText(flags.error)}</FormMessage>
      ) : flags.data.length === 0 ? (
        <p className="card">{t('signOff.empty')}</p>
      ) : (
        <ol className="space-y-4" aria-label={t('signOff.queue')}>
          {flags.data.map((flag) => (
            <li key={flag.id} className="card space-y-3">
              <FlagSummary flag={flag} linkToPage />
              <DecisionForm flag={flag} />
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
