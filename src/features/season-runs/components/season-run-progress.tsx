import type { SeasonRunDto } from '../../../../shared/api/board.schema';

/** Districts done out of the total, as a progress bar with its numbers in words. */
export function SeasonRunProgress({ run }: { run: SeasonRunDto }) {
  const total = Math.max(run.districtsTotal, 0);
  const done = Math.min(run.districtsDone, total);
  const share = total === 0 ? 0 : Math.round((done / total) * 100);
  const text = `${done.toLocaleString('en-GB')} of ${total.toLocaleString('en-GB')} districts`;
  return (
    <div className="space-y-1">
      <div
        role="progressbar"
        aria-label="Season run progress"
        aria-valuemin={0}
        aria-valuemax={total}
        aria-valuenow={done}
        aria-valuetext={`${text} (${share}%)`}
        className="progress"
      >
        <div className="progress-fill" style={{ width: `${share}%` }} />
      </div>
      <p className="text-sm tabular-nums">
        {text} ({share}%){run.districtsSkipped ? ` · ${run.districtsSkipped} skipped` : ''}
      </p>
    </div>
  );
}
