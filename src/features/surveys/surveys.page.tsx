import { useState } from 'react';
import { Link } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import { PageHeading } from '../../components/page-heading';
import { useSession } from '../../app/session';
import { useDistricts } from '../districts/api/districts.api';
import { CautionsPanel } from '../cautions/cautions-panel';
import { DistrictSurveys } from './components/district-surveys';
import { OutboxList } from './components/outbox.list';
import { SurveyFormCard } from './components/survey.form';
import { useSurveyOutbox } from './use-survey-outbox';

/** Larval surveys from the field: the form (works offline), what is waiting to be sent, and the district's recent surveys. */
export function SurveysPage() {
  const { t } = useTranslation('surveys');
  const me = useSession();
  const districts = useDistricts();
  const outbox = useSurveyOutbox();
  // A community worker surveys their own district; a health officer any district.
  const choices = me.role === 'worker' ? me.districts : (districts.data ?? []).map(({ id, code, name }) => ({ id, code, name }));
  const [chosenId, setChosenId] = useState<string | null>(null);
  const first = choices.find((d) => d.id === chosenId) ?? choices[0];
  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={t('page.lead')}>{t('page.title')}</PageHeading>
      {districts.data?.some((d) => d.isDemo) ? <p className="demo-label">{t('page.demo')}</p> : null}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,28rem)_minmax(0,1fr)]">
        <div className="card min-w-0">
          {choices.length ? <SurveyFormCard districts={choices} onDistrictChange={setChosenId} /> : <p className="text-ink-muted">{t('page.loadingDistricts')}</p>}
        </div>
        <div className="min-w-0 space-y-6">
          <OutboxList items={outbox.items} onRetry={outbox.retry} onDiscard={outbox.discard} />
          {first ? (
            <section aria-labelledby="recent-title" className="space-y-2">
              <h2 id="recent-title" className="section-title">
                {t('page.recentTitle', { district: first.name })}
              </h2>
              <DistrictSurveys districtId={first.id} />
              <Link className="link inline-block py-1 text-sm" to={`/districts/${first.id}/cases`}>
                {t('page.casesLink', { district: first.name })}
              </Link>
            </section>
          ) : null}
          <CautionsPanel />
        </div>
      </div>
    </section>
  );
}
