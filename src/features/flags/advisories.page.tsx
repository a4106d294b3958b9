import { Link } from 'react-router-dom';
import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useSession } from '../../app/session';
import { TierBadge } from '../ladder/components/tier-badge';
import { CautionsPanel } from '../cautions/cautions-panel';
import { useAdvisories } from './api/advisories.api';
import { useFlagFormat } from './flag-format';
import { useRenderMessage } from './message';
import { errorText } from '../../lib/error-text';
import { may } from '../../../shared/permissions';

/** Every advisory sent (a community worker: their district's), newest first, with the current ones marked. */
export function AdvisoriesPage() {
  const f = useFlagFormat();
  const { t } = f;
  const me = useSession();
  const advisories = useAdvisories();
  const render = useRenderMessage();
  return (
    <section aria-labelledby="page-title" className="min-w-0">
      <PageHeading lead={t('advisories.lead')}>{t('advisories.title')}</PageHeading>
      <p className="mb-4 flex flex-wrap gap-x-4 gap-y-2 text-sm">
        <Link className="link inline-block py-1" to="/preferences">
          {t('advisories.preferences')}
        </Link>
        {may(me.role, 'flags.raise') ? (
          <Link className="link inline-block py-1" to="/flags/new">
            {t('advisories.raise')}
          </Link>
        ) : null}
      </p>
      {advisories.isPending ? (
        <p className="text-ink-muted">{t('advisories.loading')}</p>
      ) : advisories.isError ? (
        <FormMessage kind="error">{errorText(advisories.error)}</FormMessage>
      ) : advisories.data.length === 0 ? (
        <p className="card">{t('advisories.empty')}</p>
      ) : (
        <ul className="space-y-4" data-testid="advisories">
          {advisories.data.map((a) => (
            <li key={a.id} className="card min-w-0 space-y-2 break-words">
              <div className="flex flex-wrap items-center gap-3">
                <h2 className="section-title !mb-0">
                  {a.districtName} ({a.districtCode})
                </h2>
                {a.tier ? <TierBadge tier={a.tier} /> : null}
                <span className="status">{a.current ? t('advisories.current') : t('advisories.past')}</span>
              </div>
              <p className="text-sm text-ink-muted">
                {t('advisories.sent', { when: f.formatWhen(a.issuedAt) })}
                {a.issuedBy ? t('advisories.signedOffBy', { who: a.issuedBy.displayName }) : ''}
                {t('advisories.recipients', { count: a.recipients })}
                {may(me.role, 'flags.read') ? (
                  <>
                    {' '}·{' '}
                    <Link className="link" to={`/flags/${a.flagId}`}>
                      {t('advisories.flagLink')}
                    </Link>
                  </>
                ) : null}
              </p>
              {/* Worded in the interface language from its code and numbers; an old advisory a person wrote, as written. */}
              <p data-testid="advisory-message">{a.composed ? render(a.composed) : a.message}</p>
              <ul className="list-disc space-y-1 pl-5 text-sm">
                {a.actions.map((x) => {
                  const action = f.action(x);
                  return (
                    <li key={x.id}>
                      <strong>{action.title}.</strong> {action.text}
                    </li>
                  );
                })}
              </ul>
              <p className="text-sm italic">{f.caution()}</p>
            </li>
          ))}
        </ul>
      )}
      <CautionsPanel className="mt-6" />
    </section>
  );
}
