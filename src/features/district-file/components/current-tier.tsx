import type { ReactNode } from 'react';
import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { tierRank, type DriverId } from '../../../../shared/tier';
import { HelpButton, type HelpTopic } from '../../help/help-button';
import { TierBadge } from '../../ladder/components/tier-badge';
import { useLadderWords, type LadderWords } from '../../ladder/ladder-format';
import { PHONE_QUERY, useMediaQuery } from '../../../lib/use-media-query';
import { detailLabel, detailValue, fixed, tierNotes } from '../district-file-format';

type TierWeek = DistrictFileResponse['tiers'][number];

export const DRIVER_HELP: Record<DriverId, HelpTopic> = {
  climate: 'climate',
  vectorClock: 'vectorClockDriver',
  larval: 'larvalDriver',
  cases: 'caseSignal',
};

/** The tier of the newest week, the drivers behind it and what moved since the week before. */
export function CurrentTier({ current, previous, help = true }: { current: TierWeek; previous: TierWeek | null; help?: boolean }) {
  const w = useLadderWords();
  const { t } = w;
  const range = current.tierLow === current.tierHigh ? null : t('district-file:tier.rangeText', { low: w.tier(current.tierLow), high: w.tier(current.tierHigh) });
  const mark = w.confidence(current.confidence);
  const Help = ({ topic }: { topic: HelpTopic }) => (help ? <HelpButton topic={topic} /> : null);
  // On a phone a five-column table made each driver a row some 230 px tall: there the drivers stack, one
  // card each with its figures as term–value rows (the printed page keeps the table).
  const phone = useMediaQuery(PHONE_QUERY);
  const stacked = phone && help;
  return (
    <section aria-labelledby="current-tier-title" className="card space-y-4">
      <div>
        <h2 id="current-tier-title" className="section-title">
          {t('district-file:tier.title', { week: w.week(current.epiYear, current.epiWeek) })}
        </h2>
        <p className="mt-2 flex flex-wrap items-center gap-x-3 gap-y-1">
          <TierBadge tier={current.tier} confidence={current.confidence} />
          <Help topic="tier" />
          <span className="tabular-nums">{t('district-file:tier.score', { score: w.score(current.score) })}</span>
          {range ? (
            <span className="inline-flex items-center gap-1.5">
              <span className="text-ink-muted">{range}</span>
              <Help topic="tierRange" />
            </span>
          ) : null}
        </p>
        {current.leadingDriver ? (
          <p className="mt-1 flex flex-wrap items-center gap-1.5 text-sm">
            <span>
              {t('district-file:tier.leadingDriver')} <strong>{w.driver(current.leadingDriver)}</strong>
            </span>
            <Help topic="leadingDriver" />
          </p>
        ) : null}
        {mark ? (
          <p className="mt-1 flex flex-wrap items-center gap-1.5 text-sm font-bold">
            <span>{t('district-file:tier.unsure', { mark })}</span>
            <Help topic="confidence" />
          </p>
        ) : null}
      </div>

      {stacked ? (
        <DriversStacked drivers={current.drivers} w={w} Help={Help} />
      ) : (
      <div className="table-wrap">
        <table className="data-table">
          <caption className="table-caption">{t('district-file:drivers.caption')}</caption>
          <thead>
            <tr>
              <th scope="col">{t('district-file:drivers.driver')}</th>
              <th scope="col">
                <span className="th-with-help">
                  {t('district-file:drivers.score')}
                  <Help topic="driverScore" />
                </span>
              </th>
              <th scope="col">
                <span className="th-with-help">
                  {t('district-file:drivers.weight')}
                  <Help topic="weight" />
                </span>
              </th>
              <th scope="col">
                <span className="th-with-help">
                  {t('district-file:drivers.contribution')}
                  <Help topic="contribution" />
                </span>
              </th>
              <th scope="col">{t('district-file:drivers.data')}</th>
            </tr>
          </thead>
          <tbody>
            {current.drivers.map((d) => (
              <tr key={d.id} data-driver={d.id}>
                <th scope="row">
                  <span className="th-with-help">
                    <span>{w.driver(d.id)}</span>
                    <Help topic={DRIVER_HELP[d.id]} />
                  </span>
                </th>
                <td className="tabular-nums">{d.score === null ? t('district-file:noData') : w.score(d.score)}</td>
                <td className="tabular-nums">{w.score(d.weight)}</td>
                <td className="tabular-nums">{w.score(d.contribution)}</td>
                <td>
                  <dl className="detail-list">
                    <DetailRows detail={d.detail} w={w} />
                  </dl>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      )}

      <WhatChanged current={current} previous={previous} w={w} help={help} />

      <div>
        <h3 className="text-base font-bold">{t('district-file:notes.title')}</h3>
        <NotesList tier={current} w={w} />
      </div>
    </section>
  );
}

/** A driver's data as term–value rows, in the table's cell and in the phone's card alike. */
function DetailRows({ detail, w }: { detail: TierWeek['drivers'][number]['detail']; w: LadderWords }) {
  return Object.entries(detail).map(([k, v]) => (
    <div key={k}>
      <dt>{detailLabel(w, k)}</dt>
      <dd>{detailValue(w, k, v)}</dd>
    </div>
  ));
}

/** The drivers on a phone: one card each, the driver as its heading, score, weight, contribution and data as rows. */
function DriversStacked({ drivers, w, Help }: { drivers: TierWeek['drivers']; w: LadderWords; Help: (p: { topic: HelpTopic }) => ReactNode }) {
  const { t } = w;
  return (
    <div data-testid="drivers-stacked">
      <h3 className="text-base font-bold">{t('district-file:drivers.caption')}</h3>
      <ul className="mt-2 space-y-3">
        {drivers.map((d) => (
          <li key={d.id} data-driver={d.id} className="driver-card rounded-lg border border-line p-3">
            <h4 className="th-with-help font-bold">
              <span>{w.driver(d.id)}</span>
              <Help topic={DRIVER_HELP[d.id]} />
            </h4>
            <dl className="driver-figures mt-1 text-sm">
              <div>
                <dt className="th-with-help">
                  {t('district-file:drivers.score')}
                  <Help topic="driverScore" />
                </dt>
                <dd className="tabular-nums">{d.score === null ? t('district-file:noData') : w.score(d.score)}</dd>
              </div>
              <div>
                <dt className="th-with-help">
                  {t('district-file:drivers.weight')}
                  <Help topic="weight" />
                </dt>
                <dd className="tabular-nums">{w.score(d.weight)}</dd>
              </div>
              <div>
                <dt className="th-with-help">
                  {t('district-file:drivers.contribution')}
                  <Help topic="contribution" />
                </dt>
                <dd className="tabular-nums">{w.score(d.contribution)}</dd>
              </div>
              <DetailRows detail={d.detail} w={w} />
            </dl>
          </li>
        ))}
      </ul>
    </div>
  );
}

export function NotesList({ tier, w }: { tier: TierWeek; w: LadderWords }) {
  const notes = tierNotes(w, tier);
  return notes.length === 0 ? (
    <p className="mt-1 text-sm text-ink-muted">{w.t('district-file:notes.none')}</p>
  ) : (
    <ul className="mt-1 list-disc space-y-1 pl-5 text-sm">
      {notes.map((n) => (
        <li key={n}>{n}</li>
      ))}
    </ul>
  );
}

/** "The tier went up 1, from High to Critical (score 0.69 → 0.81). Case signal moved it most: …", built from the stored fields. */
export function whatChangedText(w: LadderWords, current: TierWeek, previous: TierWeek | null): string {
  const { t } = w;
  if (!previous) return t('district-file:changed.noPrevious');
  const steps = tierRank(current.tier) - tierRank(previous.tier);
  const tierPart =
    steps === 0
      ? t('district-file:changed.stayed', { tier: w.tier(current.tier) })
      : t('district-file:changed.moved', { change: w.change(steps), from: w.tier(previous.tier), to: w.tier(current.tier) });
  const scorePart = t('district-file:changed.score', { before: w.score(previous.score), now: w.score(current.score) });
  const changed = current.changedDriver;
  let driverPart = t('district-file:changed.noDriver');
  if (changed) {
    const now = current.drivers.find((d) => d.id === changed)?.contribution ?? 0;
    const before = previous.drivers.find((d) => d.id === changed)?.contribution ?? 0;
    driverPart = t('district-file:changed.driver', { driver: w.driver(changed), before: fixed(w, before), now: fixed(w, now) });
  }
  return `${tierPart} ${scorePart} ${driverPart}`;
}

function WhatChanged({ current, previous, w, help }: { current: TierWeek; previous: TierWeek | null; w: LadderWords; help: boolean }) {
  return (
    <div>
      <h3 className="flex items-center gap-1.5 text-base font-bold">
        <span>{w.t('district-file:changed.title')}</span>
        {help ? <HelpButton topic="change" /> : null}
      </h3>
      <p className="mt-1 text-sm">{whatChangedText(w, current, previous)}</p>
    </div>
  );
}
