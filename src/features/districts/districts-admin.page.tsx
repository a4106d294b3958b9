import { PageHeading } from '../../components/page-heading';
import { FormMessage } from '../../components/form';
import { isForbidden } from '../../lib/api-client';
import { NotAllowedPage } from '../../app/not-allowed.page';
import { useDistricts } from './api/districts.api';
import { CreateDistrictForm } from './components/create-district.form';
import { DemoDataLabel } from './components/demo-data-label';
import { DistrictsTable } from './components/districts.table';

export function DistrictsAdminPage() {
  const districts = useDistricts();
  if (isForbidden(districts.error)) return <NotAllowedPage />;
  return (
    <section aria-labelledby="page-title">
      <PageHeading lead="Codes, names, populations by year and boundaries. Populations give incidence per 100,000; boundaries place stations in districts.">
        Districts
      </PageHeading>
      <div className="space-y-8">
        <div className="min-w-0">
          <DemoDataLabel districts={districts.data} />
          {districts.isPending ? (
            <p className="text-ink-muted">Loading districts…</p>
          ) : districts.isError ? (
            <FormMessage kind="error">{districts.error.message}</FormMessage>
          ) : (
            <DistrictsTable districts={districts.data} />
          )}
        </div>
        <div className="card">
          <CreateDistrictForm />
        </div>
      </div>
    </section>
  );
}
