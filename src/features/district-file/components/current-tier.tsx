import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { DRIVER_LABELS, TIER_LABELS, tierRank } from '../../../../shared/tier';
import { TierBadge } from '../../ladder/components/tier-badge';
import { CONFIDENCE_MARKS, tierChangeText } from '../../ladder/ladder-format';
import { detailLabel, detailValue, fixed } from '../district-file-format';

type TierWeek = DistrictFileResponse['tiers'][number];

/** The tier of the newest week, the drivers behind it and what moved since the week before. */
export function CurrentTier({ current, previous }: { current: TierWeek; previous: TierWeek | null }) {
  const range = current.tierLow === current.tierHigh ? null : `${TIER_LABELS[current.tierLow]} to ${TIER_LABELS[current.tierHigh]}`;
  const mark = CONFIDENCE_MARKS[current.confidence];
  return (
    <section aria-labelledby="current-tier-title" className="card space-y-4">
      <div>
        <h2 id="current-tier-title" className="section-title">
          Tier for week {current.epiWeek} of {current.epiYear}
        </h2>
        <p className="mt-2 flex flex-wrap items-center gap-x-3 gap-y-1">
          <TierBadge tier={current.tier} confidence={current.confidence} />
          <span className="tabular-nums">score {current.score.toFixed(2)}</span>
          {range ? <span className="text-ink-muted">range {range} (from the low and high estimates)</span> : null}
        </p>
        {current.leadingDriver ? (
          <p className="mt-1 text-sm">
            Leading driver: <strong>{DRIVER_LABELS[current.leadingDriver]}</strong>
          </p>
        ) : null}
        {mark ? (
          <p className="mt-1 text-sm font-bold">
            This tier rests on {mark}: read it as a rough guide until the inputs catch up (see the notes).
          </p>
        ) : null}
      </div>

      <div className="table-wrap">
        <table className="data-table">
          <caption className="table-caption">Drivers behind this tier</caption>
          <thead>
            <tr>
              <th scope="col">Driver</th>
              <th scope="col">Score (0–1)</th>
              <th scope="col">Weight</th>
              <th scope="col">Contribution</th>
              <th scope="col">The data behind it</th>
            </tr>
          </thead>
          <tbody>
            {current.drivers.map((d) => (
              <tr key={d.id} data-driver={d.id}>
                <th scope="row">{d.label || DRIVER_LABELS[d.id]}</th>
                <td className="tabular-nums">{d.score === null ? 'no data' : d.score.toFixed(2)}</td>
                <td className="tabular-nums">{d.weight.toFixed(2)}</td>
                <td className="tabular-nums">{d.contribution.toFixed(2)}</td>
                <td>
                  <dl className="detail-list">
                    {Object.entries(d.detail).map(([k, v]) => (
                      <div key={k}>
                        <dt>{detailLabel(k)}</dt>
                        <dd>{detailValue(k, v)}</dd>
                      </div>
                    ))}
                  </dl>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      <WhatChanged current={current} previous={previous} />

      <div>
        <h3 className="text-base font-bold">Notes on the inputs</h3>
        {current.notes.length === 0 ? (
          <p className="mt-1 text-sm text-ink-muted">Every input is present and recent.</p>
        ) : (
          <ul className="mt-1 list-disc space-y-1 pl-5 text-sm">
            {current.notes.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
        )}
      </div>
    </section>
  );
}

function WhatChanged({ current, previous }: { current: TierWeek; previous: TierWeek | null }) {
  let text: string;
  if (!previous) text = 'There is no tier for the week before, so nothing to compare yet.';
  else {
    const steps = tierRank(current.tier) - tierRank(previous.tier);
    const tierPart =
      steps === 0
        ? `The tier stayed at ${TIER_LABELS[current.tier]}`
        : `The tier went ${tierChangeText(steps)}, from ${TIER_LABELS[previous.tier]} to ${TIER_LABELS[current.tier]}`;
    const scorePart = ` (score ${previous.score.toFixed(2)} → ${current.score.toFixed(2)}).`;
    const changed = current.changedDriver;
    let driverPart = ' No single driver moved the score noticeably.';
    if (changed) {
      const now = current.drivers.find((d) => d.id === changed)?.contribution ?? 0;
      const before = previous.drivers.find((d) => d.id === changed)?.contribution ?? 0;
      driverPart = ` ${DRIVER_LABELS[changed]} moved it most: its contribution went from ${fixed(before)} to ${fixed(now)}.`;
    }
    text = tierPart + scorePart + driverPart;
  }
  return (
    <div>
      <h3 className="text-base font-bold">What changed since last week</h3>
      <p className="mt-1 text-sm">{text}</p>
    </div>
  );
}
