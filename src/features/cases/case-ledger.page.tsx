import { useState } from 'react';
import { PageHeading } from '../../components/page-heading';
import { FormMessage, SelectField } from '../../components/form';
import { useSession } from '../../app/session';
import { useDistricts } from '../districts/api/districts.api';
import { DemoDataLabel } from '../districts/components/demo-data-label';
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
        lead={
          isEpi
            ? 'Weekly counts of your districts: type them in, upload a file, correct with a reason, close a week once it is complete.'
            : 'Weekly counts of every district, with their corrections and which weeks are closed.'
        }
      >
        Case ledger
      </PageHeading>
      <DemoDataLabel districts={districts.data} />
      {settings.data ? (
        <p className="mb-3 text-sm text-ink-muted">
          {settings.data.epiWeekSystem === 'iso' ? 'ISO weeks (Monday to Sunday)' : 'Epidemiological weeks (Sunday to Saturday)'}. This is week{' '}
          {settings.data.currentWeek.week} of {settings.data.currentWeek.year}; counts are due {settings.data.deadlineDays} days after a week ends.
        </p>
      ) : null}
      <div className="mb-4 flex flex-wrap items-end gap-4">
        <SelectField label="Disease" className="field min-w-56" value={chosen ?? ''} onChange={(e) => setDiseaseId(e.currentTarget.value)}>
          {(diseases.data ?? []).map((d) => (
            <option key={d.id} value={d.id}>
              {d.name}
            </option>
          ))}
        </SelectField>
        {isEpi ? (
          <SelectField label="Districts" className="field min-w-56" value={scope} onChange={(e) => setScope(e.currentTarget.value as 'mine' | 'all')}>
            <option value="mine">My districts</option>
            <option value="all">Every district (read only outside mine)</option>
          </SelectField>
        ) : null}
      </div>
      {grid.isError ? (
        <FormMessage kind="error">{grid.error.message}</FormMessage>
      ) : grid.data && settings.data ? (
        <CaseGrid grid={grid.data} today={settings.data.today} />
      ) : (
        <p className="text-ink-muted">Loading the ledger…</p>
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
