import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { PageHeading } from '../../components/page-heading';
import { FormMessage, SelectField } from '../../components/form';
import { useSession } from '../../app/session';
import { useDistricts } from '../districts/api/districts.api';
import { DemoDataLabel } from '../districts/components/demo-data-label';
import { errorText } from '../../lib/error-text';
import { useCaseGrid } from './api/case-grid.api';
import { useCasesSettings } from './api/cases-settings.api';
import { useDiseases } from './api/diseases.api';
import { CaseEntryForm } from './components/case-entry.form';
import { CaseGrid } from './components/case-grid';
import { CaseUploadForm } from './components/case-upload.form';

/**
 * The Case ledger: weekly counts per district and disease. Epidemiologists enter, upload, correct and close
 * the weeks of their districts; supervisors read every district and close weeks.
 */
export function CaseLedgerPage() {
  const { t } = useTranslation('cases');
  const me = useSession();
  const settings = useCasesSettings();
  const diseases = useDiseases();
  const districts = useDistricts();
  const [diseaseId, setDiseaseId] = useState<string | undefined>(undefined);
  const [scope, setScope] = useState<'mine' | 'all'>(me.role === 'epidemiologist' ? 'mine' : 'all');
  const chosen = diseaseId ?? diseases.data?.[0]?.id;
  const grid = useCaseGrid(chosen, scope);
  const isEpi = me.role === 'epidemiologist';

  return (
    <section aria-labelledby="page-title">
      <PageHeading
        lead={isEpi ? t('ledger.leadEpi') : t('ledger.leadOther')}
      >
        {t('ledger.title')}
      </PageHeading>
      <DemoDataLabel districts={districts.data} />
      {settings.data ? (
        <p className="mb-3 text-sm text-ink-muted">
          {t('ledger.thisWeek', {
            system: settings.data.epiWeekSystem === 'iso' ? t('ledger.isoWeeks') : t('ledger.epiWeeks'),
            week: settings.data.currentWeek.week,
            year: settings.data.currentWeek.year,
            days: settings.data.deadlineDays,
          })}
        </p>
      ) : null}
      <div className="mb-4 flex flex-wrap items-end gap-4">
        <SelectField label={t('ledger.disease')} className="field min-w-0 sm:min-w-56" value={chosen ?? ''} onChange={(e) => setDiseaseId(e.currentTarget.value)}>
          {(diseases.data ?? []).map((d) => (
            <option key={d.id} value={d.id}>
              {d.name}
            </option>
          ))}
        </SelectField>
        {isEpi ? (
          <SelectField label={t('ledger.districts')} className="field min-w-0 sm:min-w-56" value={scope} onChange={(e) => setScope(e.currentTarget.value as 'mine' | 'all')}>
            <option value="mine">{t('ledger.mine')}</option>
            <option value="all">{t('ledger.all')}</option>
          </SelectField>
        ) : null}
      </div>
      {grid.isError ? (
        <FormMessage kind="error">{errorText(grid.error)}</FormMessage>
      ) : grid.data && settings.data ? (
        <CaseGrid grid={grid.data} today={settings.data.today} />
      ) : (
        <p className="text-ink-muted">{t('ledger.loading')}</p>
      )}
      {isEpi && settings.data && diseases.data ? (
        <div className="mt-8 grid gap-6 lg:grid-cols-2">
          <div className="card">
            <CaseEntryForm districts={me.districts} diseases={diseases.data} settings={settings.data} />
          </div>
          <div className="card">
            <CaseUploadForm />
          </div>
        </div>
      ) : null}
    </section>
  );
}
