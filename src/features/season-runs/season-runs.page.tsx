import { useId, useState } from 'react';
import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { isApiError } from '../../lib/api-client';
import { useSeasonRun } from './api/season-run.api';
import { useSeasonRuns } from './api/season-runs.api';
import { useStartSeasonRun } from './api/start-season-run.api';
import { SeasonRunProgress } from './components/season-run-progress';
import { SeasonRunsTable } from './components/season-runs.table';
import './season-runs.css';

/** The Season run history, and a way to run it now (admin, health officer) with its progress. */
export function SeasonRunsPage() {
  const id = useId();
  const runs = useSeasonRuns();
  const start = useStartSeasonRun();
  const [full, setFull] = useState(false);
  const [startedId, setStartedId] = useState<string | null>(null);
  const runningInList = runs.data?.find((r) => r.status === 'running')?.id ?? null;
  const watchedId = startedId ?? runningInList;
  const watched = useSeasonRun(watchedId);
  const run = watched.data;
  const busy = run?.status === 'running' || start.isPending;

  const onStart = () =>
    start.mutate(
      { full },
      {
        onSuccess: (r) => setStartedId(r.id),
      },
    );

  const startError = start.error
    ? isApiError(start.error) && start.error.code === 'run_in_progress'
      ? `A season run is already in progress. ${start.error.message}`
      : start.error.message
    : null;

  return (
    <section aria-labelledby="page-title">
      <PageHeading lead="The season run computes heat, the Vector clock, case signals and tiers for every district. It runs every night; run it now after a large upload or a correction.">
        Season runs
      </PageHeading>

      <div className="card mb-6 space-y-4">
        <h2 className="section-title">Run the season now</h2>
        <label className="flex items-center gap-2" htmlFor={`${id}-full`}>
          <input id={`${id}-full`} type="checkbox" className="checkbox" checked={full} onChange={(e) => setFull(e.currentTarget.checked)} disabled={busy} />
          <span>Recompute the whole season, not only the days that changed</span>
        </label>
        <div className="flex flex-wrap items-center gap-3">
          <button type="button" className="btn btn-primary" onClick={onStart} disabled={busy}>
            {start.isPending ? 'Starting…' : 'Run the season now'}
          </button>
        </div>
        <FormMessage kind="error">{startError}</FormMessage>
        {run ? (
          <div aria-live="polite" className="space-y-2">
            <p className="font-bold">
              {run.status === 'running' ? 'Season run in progress' : run.status === 'succeeded' ? 'Season run finished' : 'Season run failed'}
            </p>
            <SeasonRunProgress run={run} />
            {run.status === 'succeeded' ? <p className="text-sm">The Ladder and every District file now show the new results.</p> : null}
            {run.error ? <p className="text-sm font-bold">Error: {run.error}</p> : null}
          </div>
        ) : null}
      </div>

      {runs.isPending ? (
        <p className="text-ink-muted">Loading season runs…</p>
      ) : runs.isError ? (
        <FormMessage kind="error">{runs.error.message}</FormMessage>
      ) : (
        <SeasonRunsTable runs={runs.data} />
      )}
    </section>
  );
}
