import { useTranslation } from 'react-i18next';
import { PageHeading } from '../../components/page-heading';
import { FormMessage } from '../../components/form';
import { isForbidden } from '../../lib/api-client';
import { errorText } from '../../lib/error-text';
import { NotAllowedPage } from '../../app/not-allowed.page';
import { useDistricts } from './api/districts.api';
import { CreateDistrictForm } from './components/create-district.form';
import { ImportForm } from './components/import.form';
import { DemoDataLabel } from './components/demo-data-label';
import { DistrictsTable } from './components/districts.table';
import { RemoveDemoPanel } from './components/remove-demo.panel';
import { AssignProfilesForm } from '../profiles/components/assign-profiles.form';

export function DistrictsAdminPage() {
  const { t } = useTranslation('districts');
  const districts = useDistricts();
  if (isForbidden(districts.error)) return <NotAllowedPage />;
  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={t('page.lead')}>{t('page.title')}</PageHeading>
      <div className="space-y-8">
        <div className="min-w-0">
          <DemoDataLabel districts={districts.data} />
          {districts.isPending ? (
            <p className="text-ink-muted">{t('page.loading')}</p>
          ) : districts.isError ? (
            <FormMessage kind="error">{errorText(districts.error)}</FormMessage>
          ) : (
            <DistrictsTable districts={districts.data} />
          )}
        </div>
        {districts.data ? (
          <div className="card">
            <AssignProfilesForm districts={districts.data} />
          </div>
        ) : null}
        <div className="card">
          <ImportForm />
        </div>
        <div className="card">
          <CreateDistrictForm />
        </div>
        {districts.data?.some((d) => d.isDemo) ? (
          <div className="card">
            <RemoveDemoPanel />
          </div>
        ) : null}
      </div>
    </section>
  );
}
