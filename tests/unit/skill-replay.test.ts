import { describe, expect, it } from 'vitest';
import { epiWeekEnd, formatIsoDate, parseIsoDate, PROFILE_IDS } from '../../shared/model';
import { DEFAULT_TIER_SETTINGS } from '../../shared/tier';
import {
  casesKnownAt,
  endOfDay,
  replayDistrict,
  weatherKnownAt,
  type CaseRevisionRow,
  type ReplayDistrictInput,
  type WeatherDayVersion,
} from '../../server/skill/replay';

// The replay must use only what was known at each week's end: no look-ahead (issue 18, item 3).
const SYSTEM = 'mmwr' as const;
const DAY = 86_400_000;
const DISTRICT = { id: 'd-1', code: 'HV-01', name: 'North Fen', lat: 12.5, profiles: [{ profileId: PROFILE_IDS[0]!, biofix: null }] };
const DISEASE = 'dengue';
const WEEK = { year: 2024, week: 20 };
const AS_OF = epiWeekEnd(WEEK.year, WEEK.week, SYSTEM);

function weatherDays(): WeatherDayVersion[] {
  const out: WeatherDayVersion[] = [];
  for (let d = parseIsoDate('2021-01-01'); d <= parseIsoDate(AS_OF); d += 1) {
    const tmin = 18 + 6 * Math.sin((2 * Math.PI * d) / 365);
    out.push({ date: formatIsoDate(d), knownAt: null, tmin, tmax: tmin + 9, rh: 70, filled: false });
  }
  return out;
}

/** Counts of 2016 to 2024, each entered one day after its week ended. */
function caseRevisions(): CaseRevisionRow[] {
  const out: CaseRevisionRow[] = [];
  for (let year = 2016; year <= 2024; year += 1) {
    for (let week = 1; week <= (year === 2024 ? WEEK.week - 1 : 52); week += 1) {
      const cases = 3 + ((year * 7 + week * 3) % 5);
      out.push({ districtId: DISTRICT.id, diseaseId: DISEASE, epiYear: year, epiWeek: week, version: 1, kind: 'entry', cases,
        at: new Date(endOfDay(epiWeekEnd(year, week, SYSTEM)).getTime() + DAY / 2) });
    }
  }
  return out;
}

const input = (over: Partial<ReplayDistrictInput> = {}): ReplayDistrictInput => ({
  district: DISTRICT, weeks: [{ year: 2024, week: 18 }, { year: 2024, week: 19 }, WEEK], weather: weatherDays(),
  caseRevisions: caseRevisions(), surveys: [], excludedYears: new Map(), settings: DEFAULT_TIER_SETTINGS, epiSystem: SYSTEM,
  channelMethod: 'geometric', cusum: { k: 0.5, h: 4 }, ...over,
});

describe('replay without look-ahead', () => {
  const plain = replayDistrict(input());

  it('when the replay runs, then each week is computed as of its own last day from the weather and counts known then', () => {
    expect(plain.map((w) => w.asOf)).toEqual([18, 19, 20].map((w) => epiWeekEnd(2024, w, SYSTEM)));
    expect(plain[2]!.latestWeather).toBe(AS_OF);
    // Week 20's count is not entered yet at its end: the newest known is week 19's.
    const week19 = caseRevisions().find((r) => r.epiYear === 2024 && r.epiWeek === 19)!;
    expect(plain[2]!.casesThisWeek).toBe(week19.cases);
  });

  it('when the count for week 19 first arrives three days after week 20 ended, then the replay of week 20 ignores it', () => {
    // Week 20 itself is still open at its own end (its reporting deadline has not passed: docs/case-ledger.md
    // "Open weeks"), so the week whose count matters as of week 20's end is week 19.
    const without = caseRevisions().filter((r) => !(r.epiYear === 2024 && r.epiWeek === 19));
    const late: CaseRevisionRow = { districtId: DISTRICT.id, diseaseId: DISEASE, epiYear: 2024, epiWeek: 19, version: 1,
      kind: 'entry', cases: 999, at: new Date(endOfDay(AS_OF).getTime() + 3 * DAY) };
    const absent = replayDistrict(input({ caseRevisions: without }));
    expect(replayDistrict(input({ caseRevisions: [...without, late] }))).toEqual(absent);
    // The same count entered before week 20 ended is used (the check above is not blind).
    const inTime = { ...late, at: new Date(endOfDay(AS_OF).getTime() - DAY / 2) };
    expect(replayDistrict(input({ caseRevisions: [...without, inTime] }))[2]!.casesThisWeek).toBe(999);
  });

  it('when week 19 is corrected after week 20 ended, then the replay keeps the count as it stood', () => {
    const base = caseRevisions();
    const correction: CaseRevisionRow = { ...base.find((r) => r.epiYear === 2024 && r.epiWeek === 19)!, version: 2,
      kind: 'correction', cases: 500, at: new Date(endOfDay(AS_OF).getTime() + DAY) };
    expect(replayDistrict(input({ caseRevisions: [...base, correction] }))).toEqual(plain);
  });

  it('when a weather day is revised (and a later day loaded) after the week ended, then the replay ignores both', () => {
    const later = new Date(endOfDay(AS_OF).getTime() + 2 * DAY);
    const revised: WeatherDayVersion[] = [
      ...weatherDays(),
      { date: formatIsoDate(parseIsoDate(AS_OF) - 3), knownAt: later, tmin: 34, tmax: 45, rh: 20, filled: false },
      { date: formatIsoDate(parseIsoDate(AS_OF) + 1), knownAt: null, tmin: 34, tmax: 45, rh: 20, filled: false },
    ];
    expect(replayDistrict(input({ weather: revised }))).toEqual(plain);
    // Loaded before the week ended, the same revision changes the week's drivers (the check is not blind).
    const inTime = revised.map((v) => (v.knownAt === later ? { ...v, knownAt: new Date(endOfDay(AS_OF).getTime() - DAY) } : v));
    expect(replayDistrict(input({ weather: inTime }))[2]!.drivers).not.toEqual(plain[2]!.drivers);
  });
});

describe('what was known at a cut-off', () => {
  const at = (iso: string) => new Date(`${iso}T12:00:00Z`);
  const rev = (version: number, kind: CaseRevisionRow['kind'], cases: number, when: string): CaseRevisionRow => ({
    districtId: 'd', diseaseId: 'x', epiYear: 2024, epiWeek: 3, version, kind, cases, at: at(when),
  });
  const history = [rev(1, 'entry', 4, '2024-01-22'), rev(2, 'correction', 6, '2024-02-05'), rev(3, 'void', 6, '2024-03-01')];

  it('when the cut-off falls between revisions, then the newest version recorded by then counts', () => {
    expect(casesKnownAt(history, at('2024-01-20'))).toEqual([]);
    expect(casesKnownAt(history, at('2024-01-30'))[0]!.cases).toBe(4);
    expect(casesKnownAt(history, at('2024-02-10'))[0]!.cases).toBe(6);
    expect(casesKnownAt(history, at('2024-03-02'))).toEqual([]);
  });

  it('when a weather day has a later version, then the version loaded by the cut-off is used', () => {
    const v: WeatherDayVersion[] = [
      { date: '2024-01-02', knownAt: at('2024-01-03'), tmin: 10, tmax: 20, rh: null, filled: false },
      { date: '2024-01-02', knownAt: at('2024-01-09'), tmin: 12, tmax: 25, rh: null, filled: false },
    ];
    expect(weatherKnownAt(v, '2024-01-01', '2024-01-05', at('2024-01-05')).tmax[1]).toBe(20);
    expect(weatherKnownAt(v, '2024-01-01', '2024-01-05', at('2024-01-10')).tmax[1]).toBe(25);
    expect(weatherKnownAt(v, '2024-01-01', '2024-01-05', at('2024-01-02')).rows).toBe(0);
  });
});
