import { lastCompleteIndex, lastOpenIndex, profileLabel, sameToTwoDecimals } from '../district-file-format';
import type { ReactNode } from 'react';
import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { useUnits } from '../../../lib/units';
import { HelpButton, type HelpTopic } from '../../help/help-button';
import { useLadderWords } from '../../ladder/ladder-format';
import { lastIndexWithValue } from '../charts/chart-style';
import { eipNotCompleted } from '../charts/vector-clock.charts';

type Item = { key: string; label: string; value: string; note?: string; help: HelpTopic };

/**
 * The newest value of each number behind the tier, one line each with its "?" explanation: heat
 * accumulation, generations, EIP, survival through it and relative vectorial capacity per profile, the
 * season window, cases against the channel per disease, larval indices and the freshest weather day.
 * Temperatures and degree-days in the user's units.
 */
export function KeyNumbers({ data, help = true, headingLevel = 'h2' }: { data: DistrictFileResponse; help?: boolean; headingLevel?: 'h2' | 'h3' }) {
  const w = useLadderWords();
  const { t, f } = w;
  const units = useUnits();
  const Heading = headingLevel;
  const groups: { id: string; title: string; items: Item[] }[] = [];

  for (const vc of data.vectorClock) {
    const items: Item[] = [];
    const dd = lastIndexWithValue(vc.cumulativeDegreeDays);
    if (dd >= 0) {
      items.push({
        key: 'degreeDays',
        label: t('district-file:key.degreeDays'),
        value: `${f.number(units.toTemperatureDelta(vc.cumulativeDegreeDays[dd]!), 0)} ${units.degreeDaySymbol}`,
        note: t('district-file:key.onDay', { day: f.date(vc.dates[dd]) }),
        help: 'degreeDays',
      });
    }
    const g = lastIndexWithValue(vc.generations);
    if (g >= 0) items.push({ key: 'generations', label: t('district-file:key.generations'), value: f.number(vc.generations[g], 1, true), help: 'generations' });
    const e = lastIndexWithValue(vc.eipDays.map((d, i) => (d === null && eipNotCompleted(vc, i) ? 0 : d)));
    if (e >= 0) {
      const eipValue = eipNotCompleted(vc, e) ? t('district-file:eip.notCompleted') : t('district-file:key.days', { count: vc.eipDays[e]!, value: f.number(vc.eipDays[e], 1) });
      items.push({ key: 'eip', label: t('district-file:key.eip'), value: eipValue, help: 'eip' });
      if (vc.survivalThroughEip[e] !== null) items.push({ key: 'survivalEip', label: t('district-file:key.survivalEip'), value: f.percent(vc.survivalThroughEip[e]), help: 'survivalEip' });
    }
    const r = lastIndexWithValue(vc.rvc);
    if (r >= 0) {
      items.push({
        key: 'rvc',
        label: t('district-file:key.rvc'),
        value: f.number(vc.rvc[r], 2, true),
        // Low, central and high equal to two decimals: one value, no range.
        note: sameToTwoDecimals(w, vc.rvcLow[r], vc.rvc[r], vc.rvcHigh[r])
          ? undefined
          : t('district-file:key.lowHigh', { low: f.number(vc.rvcLow[r], 2, true), high: f.number(vc.rvcHigh[r], 2, true) }),
        help: 'rvc',
      });
    }
    if (vc.seasonOpen.length) {
      items.push({
        key: 'seasonWindow',
        label: t('district-file:key.seasonWindow'),
        value: vc.seasonOpen[vc.seasonOpen.length - 1] ? t('district-file:key.open') : t('district-file:key.closed'),
        help: 'seasonWindow',
      });
    }
    if (items.length) groups.push({ id: `vc-${vc.profileId}`, title: profileLabel({ t }, vc), items });
  }

  for (const c of data.cases) {
    // The newest complete week: a week still open for reporting holds a partial count and gets no zone.
    const i = lastCompleteIndex(c);
    const o = lastOpenIndex(c);
    if (i < 0 && o < 0) continue;
    if (i < 0) {
      groups.push({
        id: `cases-${c.diseaseId}`,
        title: c.diseaseName,
        items: [{ key: 'cases', label: t('district-file:key.casesInWeek', { week: c.weeks[o] }), value: t('district-file:cases.partialValue', { cases: f.number(c.counts[o]) }), note: t('district-file:cases.reportingOpen'), help: 'casesThisWeek' }],
      });
      continue;
    }
    const count = c.counts[i]!;
    const lower = c.channel.lower[i];
    const upper = c.channel.upper[i];
    const zone = lower === null || upper === null ? null : count > upper ? 'above' : count < lower ? 'below' : 'within';
    groups.push({
      id: `cases-${c.diseaseId}`,
      title: c.diseaseName,
      items: [
        {
          key: 'cases', label: t('district-file:key.casesInWeek', { week: c.weeks[i] }), value: f.number(count), help: 'casesThisWeek',
          note: o >= 0 ? t('district-file:cases.openWeek', { week: c.weeks[o], count: c.counts[o]!, cases: f.number(c.counts[o]) }) : undefined,
        },
        {
          key: 'channel',
          label: t('district-file:key.channel'),
          value: lower === null || upper === null ? t('district-file:noData') : t('district-file:key.band', { lower: f.number(lower, 1), upper: f.number(upper, 1) }),
          note: zone ? w.zone(zone) : undefined,
          help: 'channelZone',
        },
      ],
    });
  }

  const larval = [...data.larval].sort((a, b) => a.epiYear - b.epiYear || a.epiWeek - b.epiWeek).at(-1);
  const lastWeather = lastIndexWithValue(data.weather.tmax);
  const other: Item[] = [];
  if (larval) {
    other.push({
      key: 'larval',
      label: t('district-file:key.larval', { week: w.week(larval.epiYear, larval.epiWeek) }),
      value: t('district-file:key.larvalValues', { house: f.number(larval.house, 1), container: f.number(larval.container, 1), breteau: f.number(larval.breteau, 1) }),
      // Why these differ from the larval driver of the tier table: one week here, 28 days pooled there.
      note: t('district-file:key.larvalNote'),
      help: 'larvalIndices',
    });
  }
  other.push({
    key: 'weather',
    label: t('district-file:key.latestWeather'),
    value: lastWeather >= 0 ? f.date(data.weather.dates[lastWeather]) : t('district-file:noData'),
    note:
      lastWeather >= 0 && data.weather.tmin[lastWeather] !== null
        ? t('district-file:key.minMax', {
            min: f.number(units.toTemperature(data.weather.tmin[lastWeather]!), 1),
            max: f.number(units.toTemperature(data.weather.tmax[lastWeather]!), 1),
            unit: units.temperatureSymbol,
          })
        : undefined,
    help: 'latestWeather',
  });
  groups.push({ id: 'other', title: t('district-file:key.surveysAndWeather'), items: other });

  return (
    <section aria-labelledby="key-numbers-title" className="card key-numbers">
      <Heading id="key-numbers-title" className="section-title">
        {t('district-file:key.title')}
      </Heading>
      {/* Without the "?" buttons (the printable page), the lead does not point at them. */}
      <p className="mt-1 text-sm text-ink-muted">{t(help ? 'district-file:key.lead' : 'district-file:key.leadNoHelp')}</p>
      <div className="key-number-groups">
        {groups.map((g) => (
          <div key={g.id} className="key-number-group">
            <p className="key-number-group-title">{g.title}</p>
            <dl className="key-number-list">
              {g.items.map((item) => (
                <KeyNumber key={item.key} item={item} help={help ? <HelpButton topic={item.help} /> : null} />
              ))}
            </dl>
          </div>
        ))}
      </div>
    </section>
  );
}

function KeyNumber({ item, help }: { item: Item; help: ReactNode }) {
  return (
    <div className="key-number" data-key-number={item.key}>
      <dt>
        <span>{item.label}</span>
        {help}
      </dt>
      <dd>
        <span className="key-number-value">{item.value}</span>
        {item.note ? <span className="key-number-note">{item.note}</span> : null}
      </dd>
    </div>
  );
}
