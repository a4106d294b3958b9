import { useTranslation } from 'react-i18next';
import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useFlags } from './api/flags.api';
import { DecisionForm } from './components/decision.form';
import { FlagSummary } from './components/flag-summary';
import { errorText } from '../../lib/error-text';

/**
 * The sign-off queue (supervisor): open flags, highest tier first, then newest; decide each in place.
 * Below it the lapsed list: flags that waited longer than the flag settings allow (they may only be rejected).
 */
export function SignOffPage() {
  const { t } = useTranslation('flags');
  const flags = useFlags('open');
  const lapsed = useFlags('lapsed');
  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={t('signOff.lead')}>{t('signOff.title')}</PageHeading>
      {flags.isPending ? (
        <p className="text-ink-muted">{t('signOff.loading')}</p>
      ) : flags.isError ? (
        <FormMessage kind="error">{errorText(flags.error)}</FormMessage>
      ) : flags.data.flags.length === 0 ? (
        <p className="card">{t('signOff.empty')}</p>
      ) : (
        <ol className="space-y-4" aria-label={t('signOff.queue')}>
          {flags.data.flags.map((flag) => (
            <li key={flag.id} className="card space-y-3">
              <FlagSummary flag={flag} linkToPage />
              <DecisionForm flag={flag} />
            </li>
          ))}
        </ol>
      )}
      <h2 className="section-title mt-8" id="lapsed-title">
        {t('signOff.lapsedTitle')}
      </h2>
      {lapsed.isPending ? (
        <p className="text-ink-muted">{t('signOff.loading')}</p>
      ) : lapsed.isError ? (
        <FormMessage kind="error">{errorText(lapsed.error)}</FormMessage>
      ) : (
        <>
          <p className="mb-3 text-sm text-ink-muted">{t('signOff.lapsedLead', { count: lapsed.data.lapseWeeks })}</p>
          {lapsed.data.flags.length === 0 ? (
            <p className="card">{t('signOff.lapsedEmpty')}</p>
          ) : (
            <ol className="space-y-4" aria-labelledby="lapsed-title" data-testid="lapsed-flags">
              {lapsed.data.flags.map((flag) => (
                <li key={flag.id} className="card space-y-3">
                  <FlagSummary flag={flag} linkToPage />
                  <DecisionForm flag={flag} />
                </li>
              ))}
            </ol>
          )}
        </>
      )}
    </section>
  );
}
