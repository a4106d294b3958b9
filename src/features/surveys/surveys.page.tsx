import { Link } from 'react-router-dom';
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
  const me = useSession();
  const districts = useDistricts();
  const outbox = useSurveyOutbox();
  // A community worker surveys their own district; a health officer any district.
  const choices = me.role === 'worker' ? me.districts : (districts.data ?? []).map(({ id, code, name }) => ({ id, code, name }));
  const first = choices[0];
  return (
    <section aria-labelledby="page-title">
      <PageHeading lead="Fill in a survey where you are. It is kept on this device until Broodcast has it, so a lost connection loses nothing.">
        Surveys
      </PageHeading>
      {districts.data?.some((d) => d.isDemo) ? <p className="demo-label">Demo data — the Halvern Region is invented</p> : null}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,28rem)_minmax(0,1fr)]">
        <div className="card min-w-0">
          {choices.length ? <SurveyFormCard districts={choices} /> : <p className="text-ink-muted">Loading districts…</p>}
        </div>
        <div className="min-w-0 space-y-6">
          <OutboxList items={outbox.items} onRetry={outbox.retry} onDiscard={outbox.discard} />
          {first ? (
            <section aria-labelledby="recent-title" className="space-y-2">
              <h2 id="recent-title" className="section-title">
                Recent surveys in {first.name}
              </h2>
              <DistrictSurveys districtId={first.id} />
              <Link className="link text-sm" to={`/districts/${first.id}/cases`}>
                Cases in {first.name}
              </Link>
            </section>
          ) : null}
          <CautionsPanel />
        </div>
      </div>
    </section>
  );
}
