import { describe, expect, it } from 'vitest';
import { distanceKm, ladderOrderPlan, proposeFieldWeek, type ProposalDistrict, type ProposalInput, type ProposalTeam } from '../../shared/field/propose';
import { DAYS_NEEDED_BY_TIER, WORK_KINDS, workNeededFor, type WorkKind } from '../../shared/field/work-kinds';
import { TIERS } from '../../shared/tier/tier-settings';

const WEEK = ['2026-12-07', '2026-12-08', '2026-12-09', '2026-12-10', '2026-12-11'];

const district = (id: string, rank: number, over: Partial<ProposalDistrict> = {}): ProposalDistrict => ({
  id, name: id, rank, tier: 'high', score: 0.5, population: 100_000, lat: 25, lon: 10, leadingDriver: 'larval', ...over,
});

/** Every check a published plan must pass: capacity, one district a day, training, travel, need. */
function assertFeasible(input: ProposalInput, plan: ReturnType<typeof proposeFieldWeek>) {
  const byId = new Map(input.districts.map((d) => [d.id, d]));
  for (const team of input.teams) {
    const own = plan.assignments.filter((a) => a.teamId === team.id);
    expect(own.length).toBeLessThanOrEqual(Math.min(team.daysPerWeek, input.days.length));
    expect(new Set(own.map((a) => a.day)).size).toBe(own.length); // one district a day
    for (const a of own) {
      const d = byId.get(a.districtId)!;
      const base = byId.get(team.baseDistrictId)!;
      expect(team.kinds.some((k) => workNeededFor(d.leadingDriver).includes(k))).toBe(true);
      expect(distanceKm(base.lat!, base.lon!, d.lat!, d.lon!)).toBeLessThanOrEqual(input.maxTravelKm);
      expect(input.days).toContain(a.day);
    }
  }
  for (const d of input.districts) {
    const n = plan.assignments.filter((a) => a.districtId === d.id).length;
    expect(n).toBeLessThanOrEqual(d.tier ? DAYS_NEEDED_BY_TIER[d.tier] : 0);
  }
}

describe('Field week proposal (mixed-integer program)', () => {
  it('when a small case is solved by hand, then the solver finds the same optimum and says why each district is in or out', () => {
    // By hand: A (cases lead, 80,000) and B (larvae lead, 70,000) each need 2 days. T2 is trained for case
    // investigation only, so the best plan sends T1 to B and T2 to A: 150,000 covered, everything needing
    // a visit and in reach. C is 550 km away (limit 100), D is at Baseline, E has no centroid.
    const input: ProposalInput = {
      days: WEEK,
      maxTravelKm: 100,
      districts: [
        district('A', 1, { score: 0.8, leadingDriver: 'cases' }),
        district('B', 2, { score: 0.7, leadingDriver: 'larval', lat: 25.3 }),
        district('C', 3, { tier: 'raised', score: 0.6, lat: 30 }),
        district('D', 4, { tier: 'baseline', score: 0.1 }),
        district('E', 5, { score: 0.4, lat: null, lon: null }),
      ],
      teams: [
        { id: 'T1', name: 'One', baseDistrictId: 'A', kinds: ['larviciding', 'case-investigation'], daysPerWeek: 2 },
        { id: 'T2', name: 'Two', baseDistrictId: 'A', kinds: ['case-investigation'], daysPerWeek: 2 },
      ],
    };
    const plan = proposeFieldWeek(input);
    expect(plan.coveredRisk).toBeCloseTo(150_000, 6);
    expect(plan.assignments).toEqual([
      { teamId: 'T1', districtId: 'B', day: WEEK[0] }, { teamId: 'T1', districtId: 'B', day: WEEK[1] },
      { teamId: 'T2', districtId: 'A', day: WEEK[0] }, { teamId: 'T2', districtId: 'A', day: WEEK[1] },
    ]);
    const why = Object.fromEntries(plan.districts.map((d) => [d.districtId, d.reason]));
    expect(why.A).toEqual({ code: 'planned', params: { days: 2, teams: ['Two'] } });
    expect(why.B).toEqual({ code: 'planned', params: { days: 2, teams: ['One'] } });
    expect(why.C.code).toBe('out_of_reach');
    expect(why.C.params.limitKm).toBe(100);
    expect(Number(why.C.params.nearestKm)).toBeGreaterThan(500);
    expect(why.D).toEqual({ code: 'not_needed', params: { tier: 'baseline' } });
    expect(why.E.code).toBe('no_location');
    // The Ladder-order plan sends T1 to A (the top district) and leaves T2, trained for cases only, idle.
    expect(ladderOrderPlan(input).coveredRisk).toBeCloseTo(80_000, 6);
  });

  it('when no team is trained for the work a district needs, then it is out with the kinds it needs', () => {
    const plan = proposeFieldWeek({
      days: WEEK, maxTravelKm: 100,
      districts: [district('A', 1, { leadingDriver: 'cases' })],
      teams: [{ id: 'T', name: 'T', baseDistrictId: 'A', kinds: ['health-education'], daysPerWeek: 5 }],
    });
    expect(plan.assignments).toEqual([]);
    expect(plan.districts[0].reason).toEqual({ code: 'no_trained_team', params: { kinds: ['case-investigation', 'indoor-residual-spraying', 'space-spraying'] } });
  });

  it('when the teams have fewer days than the districts need, then the rest is out for capacity and the riskiest are in', () => {
    const plan = proposeFieldWeek({
      days: WEEK, maxTravelKm: 100,
      districts: [district('A', 1, { score: 0.9, tier: 'raised' }), district('B', 2, { score: 0.8, tier: 'raised' }), district('C', 3, { score: 0.2, tier: 'raised' })],
      teams: [{ id: 'T', name: 'T', baseDistrictId: 'A', kinds: ['larviciding'], daysPerWeek: 2 }],
    });
    expect(plan.districts.map((d) => d.reason.code)).toEqual(['planned', 'planned', 'capacity_spent']);
  });

  it('when a region-sized week is planned, then the proposal respects capacity, training and travel and covers more risk than the Ladder order', () => {
    // Deterministic invented data (a linear congruential generator): 40 districts on a 6° × 6° square,
    // 6 teams with 2–5 district-days and two or three kinds of work each, a 250 km travel limit.
    let seed = 20261205;
    const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    const drivers = ['climate', 'vectorClock', 'larval', 'cases', null] as const;
    const districts = Array.from({ length: 40 }, (_, i) => district(`D${i}`, 0, {
      score: Math.round(rnd() * 100) / 100,
      population: 20_000 + Math.round(rnd() * 180_000),
      lat: 24 + rnd() * 6, lon: 8 + rnd() * 6,
      leadingDriver: drivers[Math.floor(rnd() * drivers.length)],
    }));
    // The Ladder ranks by score; tiers by the score's cut points.
    districts.sort((a, b) => b.score! - a.score!).forEach((d, i) => {
      d.rank = i + 1;
      d.tier = TIERS[Math.min(3, Math.floor(d.score! * 4))];
    });
    const teams: ProposalTeam[] = Array.from({ length: 6 }, (_, i) => ({
      id: `T${i}`, name: `Team ${i}`, baseDistrictId: districts[Math.floor(rnd() * 40)].id, daysPerWeek: 2 + Math.floor(rnd() * 4),
      kinds: [...new Set(Array.from({ length: 2 + Math.floor(rnd() * 2) }, () => WORK_KINDS[Math.floor(rnd() * WORK_KINDS.length)]))] as WorkKind[],
    }));
    const input: ProposalInput = { days: WEEK, maxTravelKm: 250, districts, teams };
    const plan = proposeFieldWeek(input);
    const ladder = ladderOrderPlan(input);
    assertFeasible(input, plan);
    assertFeasible(input, ladder);
    console.log(`Field week, 40 districts × 6 teams: risk covered by the proposal ${Math.round(plan.coveredRisk)}, by the Ladder order ${Math.round(ladder.coveredRisk)} (of ${Math.round(plan.totalRisk)})`);
    expect(plan.coveredRisk).toBeGreaterThan(ladder.coveredRisk);
    // Every district has a reason; a district with no planned day is never listed as planned.
    for (const d of plan.districts) expect(d.daysPlanned > 0).toBe(['planned', 'partly_planned'].includes(d.reason.code));
  });

  it('when small weeks are solved, then the risk the solver covers equals the best of every possible plan (brute force)', () => {
    // 30 invented weeks of 2 teams × 3 districts; every integer plan is enumerated and the best one kept.
    let seed = 7;
    const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    const drivers = ['climate', 'vectorClock', 'larval', 'cases'] as const;
    for (let trial = 0; trial < 30; trial++) {
      const districts = Array.from({ length: 3 }, (_, i) => district(`D${i}`, i + 1, {
        tier: TIERS[1 + Math.floor(rnd() * 3)], score: Math.round(rnd() * 100) / 100, population: 10_000 + Math.round(rnd() * 90_000),
        leadingDriver: drivers[Math.floor(rnd() * 4)],
      }));
      const teams: ProposalTeam[] = Array.from({ length: 2 }, (_, i) => ({
        id: `T${i}`, name: `T${i}`, baseDistrictId: 'D0', daysPerWeek: 1 + Math.floor(rnd() * 4),
        kinds: [WORK_KINDS[Math.floor(rnd() * WORK_KINDS.length)], WORK_KINDS[Math.floor(rnd() * WORK_KINDS.length)]],
      }));
      const input: ProposalInput = { days: WEEK, maxTravelKm: 100, districts, teams };
      const may = (t: ProposalTeam, d: ProposalDistrict) => t.kinds.some((k) => workNeededFor(d.leadingDriver).includes(k));
      const need = districts.map((d) => DAYS_NEEDED_BY_TIER[d.tier!]);
      let best = 0;
      // x = [t0d0, t0d1, t0d2, t1d0, t1d1, t1d2], each 0..3
      for (let code = 0; code < 4 ** 6; code++) {
        const x = Array.from({ length: 6 }, (_, k) => Math.floor(code / 4 ** k) % 4);
        const ok = teams.every((t, ti) => x.slice(ti * 3, ti * 3 + 3).reduce((a, b) => a + b, 0) <= t.daysPerWeek
          && districts.every((d, di) => x[ti * 3 + di] === 0 || may(t, d)))
          && districts.every((_, di) => x[di] + x[3 + di] <= need[di]);
        if (!ok) continue;
        const value = districts.reduce((a, d, di) => a + (d.score! * d.population! * (x[di] + x[3 + di])) / need[di], 0);
        best = Math.max(best, value);
      }
      expect(proposeFieldWeek(input).coveredRisk).toBeCloseTo(best, 6);
    }
  });
});
