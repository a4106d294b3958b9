import { useId, useState } from 'react';
import { useTranslation } from 'react-i18next';
import type { LookBackRunDto } from '../../../shared/api/look-back.schema';
import { LOOK_BACK_MAX_SEASONS } from '../../../shared/api/look-back.schema';
import { may } from '../../../shared/permissions';
import { useSession } from '../../app/session';
import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useFormat } from '../../i18n/format';
import { isApiError } from '../../lib/api-client';
import { errorText } from '../../lib/error-text';
import { problemReasonText } from '../../lib/problem-text';
import { CautionsPanel } from '../cautions/cautions-panel';
import { useLookBackRun } from './api/look-back-run.api';
import { useLookBackRuns } from './api/look-back-runs.api';
import { useLookBackScores, type WarnAt } from './api/look-back-scores.api';
import { useStartLookBack } from './api/start-look-back.api';
import { SkillByLeadChart } from './components/skill-by-lead.chart';

const WARN_AT: readonly WarnAt[] = ['raised', 'high', 'critical'];

/**
 * The Look-back: replay past seasons with only the data known then, and see how often the tier warned
 * before cases crossed the epidemic threshold, beside simple null models (docs/skill.md).
 */
export function LookBackPage() {
  const { t } = useTranslation('look-back');
  const f = useFormat();
  const id = useId();
  const me = useSession();
  const mayStart = may(me.role, 'lookBack.start');
  const runs = useLookBackRuns();
  const start = useStartLookBack();
  const thisYear = new Date().getFullYear();
  const [fromYear, setFromYear] = useState(String(thisYear - 3));
  const [toYear, setToYear] = useState(String(thisYear - 1));
  const [chosenId, setChosenId] = useState<string | null>(null);
  const [warnAt, setWarnAt] = useState<WarnAt>('high');
  const list = runs.data ?? [];
  const watchedId = chosenId ?? list.find((r) => r.status === 'running')?.id ?? list.find((r) => r.status === 'succeeded')?.id ?? null;
  const watched = useLookBackRun(watchedId);
  const run = watched.data;
  const scores = useLookBackScores(run?.status === 'succeeded' ? run.id : null, warnAt);
  const busy = run?.status === 'running' || start.isPending;

  const onStart = (e: React.FormEvent) => {
    e.preventDefault();
    start.mutate({ fromYear: Number(fromYear), toYear: Number(toYear) }, { onSuccess: (r) => setChosenId(r.id) });
  };
  const startError = start.error
    ? isApiError(start.error) && start.error.code === 'look_back_in_progress'
      ? t('alreadyRunning')
      : errorText(start.error)
    : null;
  const overall = scores.data?.groups[0];

  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={t('lead')}>{t('title')}</PageHeading>
      <p className="mb-4 rounded border border-line p-3 text-sm" role="note">
        {t('caution')}
      </p>

      {mayStart ? (
        <form className="card mb-6 space-y-4" onSubmit={onStart} noValidate>
          <h2 className="section-title">{t('start.title')}</h2>
          <p className="text-sm">{t('start.help', { max: LOOK_BACK_MAX_SEASONS })}</p>
          <div className="flex flex-wrap items-end gap-4">
            <label className="field" htmlFor={`${id}-from`}>
              <span className="field-label">{t('start.fromYear')}</span>
              <input id={`${id}-from`} className="input w-28" type="number" inputMode="numeric" min={1900} max={thisYear} value={fromYear} onChange={(e) => setFromYear(e.currentTarget.value)} disabled={busy} />
            </label>
            <label className="field" htmlFor={`${id}-to`}>
              <span className="field-label">{t('start.toYear')}</span>
              <input id={`${id}-to`} className="input w-28" type="number" inputMode="numeric" min={1900} max={thisYear} value={toYear} onChange={(e) => setToYear(e.currentTarget.value)} disabled={busy} />
            </label>
            <button type="submit" className="btn btn-primary" disabled={busy}>
              {start.isPending ? t('start.starting') : t('start.button')}
            </button>
          </div>
          <FormMessage kind="error">{startError}</FormMessage>
        </form>
      ) : null}

      {run ? <RunStatus run={run} /> : null}

      {run?.status === 'succeeded' ? (
        <div className="card mb-6 space-y-4">
          <h2 className="section-title">{t('scores.title', { from: run.fromYear, to: run.toYear })}</h2>
          <p className="text-sm">{t('scores.help')}</p>
          <label className="field max-w-xs" htmlFor={`${id}-warn`}>
            <span className="field-label">{t('scores.warnAt')}</span>
            <select id={`${id}-warn`} className="input" value={warnAt} onChange={(e) => setWarnAt(e.currentTarget.value as WarnAt)}>
              {WARN_AT.map((w) => (
                <option key={w} value={w}>
                  {t(`warnAt.${w}`)}
                </option>
              ))}
            </select>
          </label>
          {scores.isPending ? (
            <p className="text-ink-muted">{t('loading')}</p>
          ) : scores.isError ? (
            <FormMessage kind="error">{errorText(scores.error)}</FormMessage>
          ) : overall ? (
            <>
              <SkillByLeadChart leads={overall.leads} measure="hitRate" />
              <SkillByLeadChart leads={overall.leads} measure="falseAlarmRatio" />
              <p className="text-sm">
                {overall.leadTimes.length === 0
                  ? t('scores.noOnsets')
                  : t('scores.leadTimes', { count: overall.leadTimes.length, n: f.number(overall.leadTimes.length), median: f.number(median(overall.leadTimes)) })}
              </p>
            </>
          ) : null}
        </div>
      ) : null}

      <div className="card mb-6">
        <h2 className="section-title">{t('runs.title')}</h2>
        {runs.isPending ? (
          <p className="text-ink-muted">{t('loading')}</p>
        ) : runs.isError ? (
          <FormMessage kind="error">{errorText(runs.error)}</FormMessage>
        ) : list.length === 0 ? (
          <p className="text-ink-muted">{t('runs.empty')}</p>
        ) : (
          <div className="table-wrap">
            <table className="data-table">
              <caption className="table-caption">{t('runs.caption')}</caption>
              <thead>
                <tr>
                  <th scope="col">{t('runs.seasons')}</th>
                  <th scope="col">{t('runs.status')}</th>
                  <th scope="col">{t('runs.started')}</th>
                  <th scope="col">{t('runs.districts')}</th>
                  <th scope="col">
                    <span className="sr-only">{t('runs.show')}</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {list.map((r) => (
                  <tr key={r.id} aria-current={r.id === watchedId ? 'true' : undefined}>
                    <th scope="row" className="font-normal">
                      {t('runs.span', { from: r.fromYear, to: r.toYear })}
                    </th>
                    <td>{t(`status.${r.status}`)}</td>
                    <td>{f.dateTime(r.startedAt)}</td>
                    <td className="tabular-nums">
                      {f.number(r.districtsDone)} / {f.number(r.districtsTotal)}
                    </td>
                    <td>
                      <button type="button" className="btn btn-quiet btn-small" onClick={() => setChosenId(r.id)} disabled={r.id === watchedId}>
                        {t('runs.show')}
                      </button>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </div>

      <CautionsPanel />
    </section>
  );
}

/** The watched run: its state, progress and the districts it could not replay. */
function RunStatus({ run }: { run: LookBackRunDto }) {
  const { t } = useTranslation('look-back');
  const f = useFormat();
  const total = Math.max(run.districtsTotal, 0);
  const done = Math.min(run.districtsDone, total);
  const share = total === 0 ? 0 : done / total;
  const text = t('progress.text', { count: total, done: f.number(done), total: f.number(total), percent: f.percent(share) });
  const failed = run.warnings.filter((w) => w.code === 'district_failed');
  return (
    <div className="card mb-6 space-y-2" aria-live="polite">
      <p className="font-bold">{t(`runStatus.${run.status}`, { from: run.fromYear, to: run.toYear })}</p>
      <div role="progressbar" aria-label={t('progress.label')} aria-valuemin={0} aria-valuemax={total} aria-valuenow={done} aria-valuetext={text} className="progress">
        <div className="progress-fill" style={{ width: `${Math.round(share * 100)}%` }} />
      </div>
      <p className="text-sm tabular-nums">{text}</p>
      {run.error ? <p className="text-sm font-bold">{t('runError', { code: run.error === 'interrupted' ? t('interrupted') : problemReasonText({ code: run.error }) })}</p> : null}
      {failed.length ? (
        <details>
          <summary className="text-sm">{t('failed.summary', { count: failed.length, n: f.number(failed.length) })}</summary>
          <ul className="mt-1 list-disc pl-5 text-sm">
            {failed.map((w, i) => (
              <li key={i}>{t('failed.line', { district: w.districtName ?? '', reason: problemReasonText(w.reason) })}</li>
            ))}
          </ul>
        </details>
      ) : null}
    </div>
  );
}

function median(xs: readonly number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}
