import { useId, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { isApiError } from '../../lib/api-client';
import { errorText } from '../../lib/error-text';
import { useSeasonRun } from './api/season-run.api';
import { useSeasonRuns } from './api/season-runs.api';
import { useStartSeasonRun } from './api/start-season-run.api';
import { SeasonRunProgress } from './components/season-run-progress';
import { runErrorText, SeasonRunsTable } from './components/season-runs.table';
import './season-runs.css';

/** The Season run history, and a way to run it now (admin, health officer) with its progress. */
export function SeasonRunsPage() {
  const { t } = useTranslation('season-runs');
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

  const startError = start.error ? startErrorText(start.error, t('alreadyRunning')) : null;

  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={t('lead')}>{t('title')}</PageHeading>

      <div className="card mb-6 space-y-4">
        <h2 className="section-title">{t('runNow')}</h2>
        <label className="flex items-center gap-2" htmlFor={`${id}-full`}>
          <input id={`${id}-full`} type="checkbox" className="checkbox" checked={full} onChange={(e) => setFull(e.currentTarget.checked)} disabled={busy} />
          <span>{t('fullLabel')}</span>
        </label>
        <div className="flex flex-wrap items-center gap-3">
          <button type="button" className="btn btn-primary" onClick={onStart} disabled={busy}>
            {start.isPending ? t('starting') : t('runNow')}
          </button>
        </div>
        <FormMessage kind="error">{startError}</FormMessage>
        {run ? (
          <div aria-live="polite" className="space-y-2">
            <p className="font-bold">
              {t(`runStatus.${run.status}`)}
            </p>
            <SeasonRunProgress run={run} />
            {run.status === 'succeeded' ? <p className="text-sm">{t('finishedNote')}</p> : null}
            {run.error ? <p className="text-sm font-bold">{runErrorText(run.error, t)}</p> : null}
          </div>
        ) : null}
      </div>

      {runs.isPending ? (
        <p className="text-ink-muted">{t('loading')}</p>
      ) : runs.isError ? (
        <FormMessage kind="error">{errorText(runs.error)}</FormMessage>
      ) : (
        <SeasonRunsTable runs={runs.data} />
      )}
    </section>
  );
}

/** A refused start: "already in progress" leads, followed by the server's (or the translated) detail, never said twice. */
function startErrorText(error: unknown, alreadyRunning: string): string {
  const detail = errorText(error);
  if (!(isApiError(error) && error.code === 'run_in_progress')) return detail;
  return detail.startsWith(alreadyRunning) ? detail : `${alreadyRunning} ${detail}`;
}
