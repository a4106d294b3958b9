import { useTranslation } from 'react-i18next';
import type { SeasonRunDto } from '../../../../shared/api/board.schema';
import { useFormat } from '../../../i18n/format';
import { failedSummary } from './season-runs.table';

/** Districts done out of the total, as a progress bar with its numbers in words. */
export function SeasonRunProgress({ run }: { run: SeasonRunDto }) {
  const { t } = useTranslation('season-runs');
  const f = useFormat();
  const total = Math.max(run.districtsTotal, 0);
  const done = Math.min(run.districtsDone, total);
  const share = total === 0 ? 0 : done / total;
  const text = t('progress.text', { count: total, done: f.number(done), total: f.number(total), percent: f.percent(share) });
  return (
    <div className="space-y-1">
      <div
        role="progressbar"
        aria-label={t('progress.label')}
        aria-valuemin={0}
        aria-valuemax={total}
        aria-valuenow={done}
        aria-valuetext={text}
        className="progress"
      >
        <div className="progress-fill" style={{ width: `${Math.round(share * 100)}%` }} />
      </div>
      <p className="text-sm tabular-nums">
        {text}
        {run.districtsSkipped ? ` · ${t('progress.skipped', { count: run.districtsSkipped, n: f.number(run.districtsSkipped) })}` : ''}
        {failedSummary(run, t, f)}
      </p>
    </div>
  );
}
