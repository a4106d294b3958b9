import { PageHeading } from '../../components/page-heading';
import { FormMessage } from '../../components/form';
import { CautionsPanel } from '../cautions/cautions-panel';
import { useDistricts } from '../districts/api/districts.api';
import { DemoDataLabel } from '../districts/components/demo-data-label';
import { LadderDistrictsTable } from './ladder-districts.table';

/** The home screen. For now the districts in view; the ranking by Tier arrives with the season run. */
export function LadderPage() {
  const districts = useDistricts();
  return (
    <section aria-labelledby="page-title">
      <PageHeading lead="Ranking by tier arrives with the season run. Until then, these are the districts in your view.">
        Ladder
      </PageHeading>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="min-w-0">
          <DemoDataLabel districts={districts.data} />
          {districts.isPending ? (
            <p className="text-ink-muted">Loading districts…</p>
          ) : districts.isError ? (
            <FormMessage kind="error">{districts.error.message}</FormMessage>
          ) : (
            <LadderDistrictsTable districts={districts.data} />
          )}
        </div>
        <CautionsPanel className="self-start" />
      </div>
    </section>
  );
}
