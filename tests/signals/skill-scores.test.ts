import { describe, expect, it } from 'vitest';
import {
  bootstrapBySeason,
  brierScore,
  channelAloneModel,
  climatologyModel,
  contingency,
  eventWeeks,
  falseAlarmRate,
  falseAlarmRatio,
  hitRate,
  leadTimes,
  pairAtLead,
  persistenceModel,
  rocAuc,
  skillReport,
  type ScoredPair,
  type ScoredWeek,
} from '../../shared/skill';

// Definitions: Wilks 2011, "Statistical Methods in the Atmospheric Sciences", 3rd ed., ch. 8
// (2×2 contingency table, hit rate eq. 8.12, false-alarm ratio eq. 8.13, false-alarm rate eq. 8.14,
// Brier score eq. 8.36); Jolliffe & Stephenson 2012, "Forecast Verification", 2nd ed., ch. 3;
// Hanley & McNeil 1982, Radiology 143:29–36 (ROC area = Mann–Whitney U / (n₁·n₀), ties half).
// Every expected value below is hand-computed (derived) from those definitions.

const S1_SCORES = [0, 1, 2, 2, 3, 1, 0, 0];
const S1_EVENTS = [false, false, false, true, true, false, false, false];
const S2_EVENTS = [false, false, false, true, false, false, false, false];
const week = (season: string, w: number, score: number, event: boolean | null): ScoredWeek => ({
  district: 'north-fen',
  season,
  week: w,
  score,
  event,
});
const S1 = S1_SCORES.map((s, w) => week('2021', w, s, S1_EVENTS[w]!));
const S2 = S1_SCORES.map((_, w) => week('2022', w, 0, S2_EVENTS[w]!));

describe('contingency table and its scores (Wilks 2011 ch. 8)', () => {
  const lead1 = pairAtLead(S1, 1);

  it('when warnings are paired one week ahead, then each week meets the event of the next week and the last week drops out', () => {
    expect(lead1.map((p) => [p.week, p.score, p.event])).toEqual([
      [0, 0, false],
      [1, 1, false],
      [2, 2, true],
      [3, 2, true],
      [4, 3, false],
      [5, 1, false],
      [6, 0, false],
    ]);
  });

  it('when the warning is tier ≥ 2, then a=2, b=1, c=0, d=4, hit rate 1, false-alarm ratio 1/3, false-alarm rate 1/5 — hand-computed (derived)', () => {
    const t = contingency(lead1, 2);
    expect(t).toEqual({ hits: 2, falseAlarms: 1, misses: 0, correctNegatives: 4 });
    expect(hitRate(t)).toBe(1);
    expect(falseAlarmRatio(t)).toBeCloseTo(1 / 3, 12);
    expect(falseAlarmRate(t)).toBeCloseTo(1 / 5, 12);
  });

  it('when the warning is tier ≥ 3, then a=0, b=1, c=2, d=4, hit rate 0 and false-alarm ratio 1 — hand-computed (derived)', () => {
    const t = contingency(lead1, 3);
    expect(t).toEqual({ hits: 0, falseAlarms: 1, misses: 2, correctNegatives: 4 });
    expect(hitRate(t)).toBe(0);
    expect(falseAlarmRatio(t)).toBe(1);
  });

  it('when there is no event and no warning, then hit rate and false-alarm ratio are undefined (null), not zero', () => {
    const t = contingency([{ district: 'x', season: 's', week: 0, score: 0, event: false }], 1);
    expect(hitRate(t)).toBeNull();
    expect(falseAlarmRatio(t)).toBeNull();
  });

  it('when an outcome week is undecided, then its pair is left out', () => {
    const weeks = [week('2021', 0, 2, false), week('2021', 1, 0, null)];
    expect(pairAtLead(weeks, 1)).toEqual([]);
  });
});

describe('ROC area, Mann–Whitney form (Hanley & McNeil 1982)', () => {
  it('when event scores are 2, 2 and non-event scores 0, 1, 3, 1, 0, then AUC = 8/10 — hand-computed (derived)', () => {
    expect(rocAuc(pairAtLead(S1, 1))).toBeCloseTo(0.8, 12);
  });

  it('when an event and a non-event share a score, then the tie counts one half: AUC = 3.5/4 — hand-computed (derived)', () => {
    const pairs: ScoredPair[] = [
      { district: 'd', season: 's', week: 0, score: 1, event: true },
      { district: 'd', season: 's', week: 1, score: 2, event: true },
      { district: 'd', season: 's', week: 2, score: 1, event: false },
      { district: 'd', season: 's', week: 3, score: 0, event: false },
    ];
    expect(rocAuc(pairs)).toBeCloseTo(0.875, 12);
    // Brier with calibration by event frequency per score: score 1 → 1/2, score 2 → 1, score 0 → 0;
    // (0.25 + 0 + 0.25 + 0) / 4 = 0.125 — hand-computed (derived), Wilks 2011 eq. 8.36.
    expect(brierScore(pairs)).toBeCloseTo(0.125, 12);
  });

  it('when there are no events, then the AUC is undefined (null)', () => {
    expect(rocAuc(pairAtLead(S2, 5))).toBeNull();
  });
});

describe('Brier score (Wilks 2011 eq. 8.36)', () => {
  it('when probabilities 0.8, 0.2, 0.5 meet outcomes 1, 0, 1, then BS = (0.04 + 0.04 + 0.25)/3 = 0.11 — hand-computed (derived)', () => {
    const pairs: ScoredPair[] = [0.8, 0.2, 0.5].map((score, i) => ({
      district: 'd',
      season: 's',
      week: i,
      score,
      event: i !== 1,
    }));
    expect(brierScore(pairs, true)).toBeCloseTo(0.11, 12);
  });
});

describe('lead time before each event onset', () => {
  it('when the onset in week 3 follows warnings in weeks 1–2, then the lead is 2 weeks at tier ≥ 1, 1 at tier ≥ 2 and 0 at tier ≥ 3 — hand-computed (derived)', () => {
    expect(leadTimes(S1, 1)).toEqual([2]);
    expect(leadTimes(S1, 2)).toEqual([1]);
    expect(leadTimes(S1, 3)).toEqual([0]);
  });

  it('when the lead is longer than the cap, then it is reported at the cap', () => {
    expect(leadTimes(S1, 1, 1)).toEqual([1]);
  });
});

describe('event definition: leave-one-season-out endemic channel', () => {
  // Quartile channel, Hyndman & Fan 1996 definition 7. Week 0 of season D: other seasons 1, 2, 3,
  // Q3 = 2 + 0.5·(3 − 2) = 2.5, count 10 > 2.5 → event. Week 0 of A: others 2, 3, 10, Q3 = 6.5,
  // count 1 → no event. Week 1 of A: others 2, 2, 2, Q3 = 2, count 5 → event. Week 1 of B: others
  // 5, 2, 2, Q3 = 3.5, count 2 → no event. Hand-computed (derived).
  const seasons = [
    { season: 'A', counts: [1, 5] },
    { season: 'B', counts: [2, 2] },
    { season: 'C', counts: [3, 2] },
    { season: 'D', counts: [10, 2] },
  ];

  it('when a count is above the upper line computed without its own season, then it is an event', () => {
    const ev = eventWeeks(seasons, { method: 'quartile' });
    expect(ev.get('D')).toEqual([true, false]);
    expect(ev.get('A')).toEqual([false, true]);
    expect(ev.get('B')).toEqual([false, false]);
  });

  it('when the line is the centre instead, then more weeks are events (configurable)', () => {
    // Week 0 of C: others 1, 2, 10, median 2, count 3 → event.
    expect(eventWeeks(seasons, { method: 'quartile', line: 'centre' }).get('C')?.[0]).toBe(true);
  });

  it('when fewer than two other seasons have the week, or the count is missing, then the week is undecided', () => {
    const ev = eventWeeks(
      [
        { season: 'A', counts: [1, null] },
        { season: 'B', counts: [2] },
      ],
      { method: 'quartile' },
    );
    expect(ev.get('A')).toEqual([null, null]);
  });
});

describe('null models on the same weeks', () => {
  it('when the same week was an event in the other season, then climatology scores it 1, else 0', () => {
    const clim = climatologyModel([...S1, ...S2]);
    const s1 = clim.filter((w) => w.season === '2021').map((w) => w.score);
    expect(s1).toEqual([0, 0, 0, 1, 0, 0, 0, 0]);
    const s2 = clim.filter((w) => w.season === '2022').map((w) => w.score);
    expect(s2).toEqual([0, 0, 0, 1, 1, 0, 0, 0]);
  });

  it("when persistence issues week w, then its score is week w − 1's event state", () => {
    expect(persistenceModel(S1).map((w) => w.score)).toEqual([0, 0, 0, 0, 1, 1, 0, 0]);
  });

  it('when the channel alone is read, then it uses the previous week and only earlier seasons (no look-ahead)', () => {
    const seasons = [
      { season: 'A', counts: [1, 5] },
      { season: 'B', counts: [2, 2] },
      { season: 'C', counts: [3, 2] },
      { season: 'D', counts: [10, 2] },
    ];
    const weeks = seasons.flatMap((s) => s.counts.map((_, w) => week(s.season, w, 0, false)));
    const scored = channelAloneModel('north-fen', seasons, { method: 'quartile' }, weeks);
    const at = (season: string, w: number) => scored.find((x) => x.season === season && x.week === w)!.score;
    // D week 1 reads D week 0: count 10 / Q3 of A, B, C = 2.5 → 4 (derived).
    expect(at('D', 1)).toBeCloseTo(4, 12);
    // C week 1 reads C week 0: count 3 / Q3 of A, B only (1, 2) = 1.75 (derived).
    expect(at('C', 1)).toBeCloseTo(3 / 1.75, 12);
    // B has one earlier season: no channel yet.
    expect(at('B', 1)).toBe(0);
    expect(at('D', 0)).toBe(0);
  });
});

describe('bootstrap confidence interval resampling whole seasons', () => {
  const hit2 = (pairs: readonly ScoredPair[]) => hitRate(contingency(pairs, 2));

  it('when the same seed is used twice, then the interval is the same, and it brackets the estimate', () => {
    const many: ScoredWeek[] = [];
    for (let s = 0; s < 12; s += 1) {
      const events = S1_EVENTS.map((e, w) => (s % 3 === 0 ? w === 6 : e));
      S1_SCORES.forEach((score, w) => many.push({ ...week(String(2000 + s), w, score, events[w]!) }));
    }
    const pairs = pairAtLead(many, 1);
    const a = bootstrapBySeason(pairs, hit2, { seed: 7, replicates: 300 });
    const b = bootstrapBySeason(pairs, hit2, { seed: 7, replicates: 300 });
    expect(a).toEqual(b);
    expect(a.lower!).toBeLessThanOrEqual(a.estimate!);
    expect(a.upper!).toBeGreaterThanOrEqual(a.estimate!);
    expect(a.upper! - a.lower!).toBeGreaterThan(0);
  });

  it('when every season scores alike, then the interval collapses on the estimate whatever the seed', () => {
    const alike = [S1, S1.map((w) => ({ ...w, season: '2022' })), S1.map((w) => ({ ...w, season: '2023' }))].flat();
    for (const seed of [1, 2, 3]) {
      const ci = bootstrapBySeason(pairAtLead(alike, 1), hit2, { seed, replicates: 50 });
      expect(ci).toEqual({ estimate: 1, lower: 1, upper: 1, replicates: 50 });
    }
  });
});

describe('skill report: the tier beside the null models on the same weeks', () => {
  // Quartile channel, leave-one-season-out. Only week 1 of C is an event: others 1, 1, Q3 = 1, count 5.
  // Week 1 of A: others 1, 5, Q3 = 1 + 0.75·4 = 4, count 1 → no event. Hand-computed (derived).
  const input = {
    district: 'north-fen',
    seasons: [
      { season: 'A', counts: [1, 1, 1, 1] },
      { season: 'B', counts: [1, 1, 1, 1] },
      { season: 'C', counts: [1, 5, 1, 1] },
    ],
    tierRanks: new Map<string, number[]>([
      ['A', [0, 2, 0, 0]],
      ['B', [0, 0, 0, 0]],
      ['C', [2, 3, 0, 0]],
    ]),
  };
  const report = skillReport([input], { leads: [1], level: 2, event: { method: 'quartile' }, replicates: 50 });
  const lead1 = report.overall[0]!;

  it('when the tier ≥ 2 warns one week ahead, then a=1 (C0), b=2 (A1, C1), c=0, d=6 — hand-computed (derived)', () => {
    expect(lead1.pairs).toBe(9);
    expect(lead1.tier.table).toEqual({ hits: 1, falseAlarms: 2, misses: 0, correctNegatives: 6 });
    expect(lead1.tier.hitRate).toBe(1);
    expect(lead1.tier.falseAlarmRatio).toBeCloseTo(2 / 3, 12);
  });

  it('when persistence is scored on the same weeks, then it misses the onset and raises one false alarm — hand-computed (derived)', () => {
    expect(lead1.persistence.table).toEqual({ hits: 0, falseAlarms: 1, misses: 1, correctNegatives: 7 });
    expect(report.districts[0]!.leads[0]!.tier.table).toEqual(lead1.tier.table);
    expect(report.leadTimes).toEqual([1]);
  });
});
