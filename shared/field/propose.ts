/**
 * The Field week proposal: which team goes to which district on which days of the coming week.
 * Pure (no I/O); the server feeds it the current Ladder rows and the teams.
 *
 * The problem is solved as a mixed-integer program with javascript-lp-solver (simplex with branch and
 * bound), not a hand-written heuristic. Model:
 *   x[t,d] ∈ {0,1,…}: district-days team t works in district d, only for pairs the team may serve
 *     (trained for at least one kind of work the district needs, and the district within the travel
 *     limit of the team's base);
 *   maximise Σ x[t,d] · risk[d] / need[d]  (risk covered: a district is fully covered by its needed days);
 *   subject to Σ_d x[t,d] ≤ capacity[t] (district-days per week, at most the working days),
 *              Σ_t x[t,d] ≤ need[d].
 * risk[d] = tier score × population at risk × visit weight. Population at risk is the district's newest
 * population (the whole district is taken to be at risk). The visit weight would raise districts not
 * visited recently; no Field log exists yet, so every district weighs 1 (`VISIT_WEIGHT`).
 * Travel is the straight-line (great-circle, haversine) distance between district centroids, not road
 * distance or time.
 * The days are laid out after solving: each team works its districts on consecutive working days, the
 * riskiest first, one district a day.
 */
import solver from 'javascript-lp-solver';
import type { DriverId, Tier } from '../tier/tier-settings';
import { DAYS_NEEDED_BY_TIER, type WorkKind, workNeededFor } from './work-kinds';

/** Weight of a district not visited recently. With no Field log yet every district weighs the same. */
export const VISIT_WEIGHT = 1;

export interface ProposalDistrict {
  id: string;
  name: string;
  /** Position in the Ladder (1 = riskiest). */
  rank: number;
  tier: Tier | null;
  /** Tier score, 0–1. */
  score: number | null;
  population: number | null;
  lat: number | null;
  lon: number | null;
  leadingDriver: DriverId | null;
}

export interface ProposalTeam {
  id: string;
  name: string;
  baseDistrictId: string;
  kinds: readonly WorkKind[];
  daysPerWeek: number;
}

export interface ProposalInput {
  districts: ProposalDistrict[];
  teams: ProposalTeam[];
  /** The working days of the coming week (ISO dates, in order). */
  days: string[];
  /** Travel limit from a team's base, straight-line km between centroids. */
  maxTravelKm: number;
}

export type ReasonParams = Record<string, string | number | string[]>;
/** Why a district is in or out, as a code with its parameters (the client words it). */
export type DistrictReasonCode =
  | 'planned' | 'partly_planned' | 'no_tier' | 'not_needed' | 'no_population' | 'no_location'
  | 'no_teams' | 'no_trained_team' | 'out_of_reach' | 'capacity_spent';

export interface DistrictDecision {
  districtId: string;
  rank: number;
  tier: Tier | null;
  risk: number;
  daysNeeded: number;
  daysPlanned: number;
  workNeeded: WorkKind[];
  reason: { code: DistrictReasonCode; params: ReasonParams };
}

export interface PlannedDay {
  teamId: string;
  districtId: string;
  day: string;
}

export interface Proposal {
  assignments: PlannedDay[];
  districts: DistrictDecision[];
  teams: { teamId: string; capacity: number; daysPlanned: number }[];
  /** Σ risk covered (risk × share of the needed days planned). */
  coveredRisk: number;
  /** Σ risk of every district that needs a visit. */
  totalRisk: number;
  method: 'milp' | 'ladder-order';
  visitWeight: number;
}

const EARTH_RADIUS_KM = 6371.0088;
/** Great-circle distance (haversine) in km. Hand-written: six lines, no package needed for it. */
export function distanceKm(lat1: number, lon1: number, lat2: number, lon2: number): number {
  const r = Math.PI / 180;
  const a = Math.sin(((lat2 - lat1) * r) / 2) ** 2 + Math.cos(lat1 * r) * Math.cos(lat2 * r) * Math.sin(((lon2 - lon1) * r) / 2) ** 2;
  return 2 * EARTH_RADIUS_KM * Math.asin(Math.min(1, Math.sqrt(a)));
}

interface Prepared {
  d: ProposalDistrict;
  risk: number;
  need: number;
  work: WorkKind[];
  /** Teams that may serve it, with the distance from their base. */
  eligible: { team: ProposalTeam; km: number }[];
  out: { code: DistrictReasonCode; params: ReasonParams } | null;
}

const round = (x: number, digits = 1) => Math.round(x * 10 ** digits) / 10 ** digits;

function prepare(input: ProposalInput): { prepared: Prepared[]; capacity: Map<string, number> } {
  const byId = new Map(input.districts.map((d) => [d.id, d]));
  const capacity = new Map(input.teams.map((t) => [t.id, Math.max(0, Math.min(t.daysPerWeek, input.days.length))]));
  const prepared = [...input.districts].sort((a, b) => a.rank - b.rank).map((d): Prepared => {
    const need = d.tier ? DAYS_NEEDED_BY_TIER[d.tier] : 0;
    const work = [...workNeededFor(d.leadingDriver)];
    const risk = (d.score ?? 0) * (d.population ?? 0) * VISIT_WEIGHT;
    const base = { d, need, work, eligible: [] as Prepared['eligible'] };
    if (!d.tier || d.score === null) return { ...base, risk: 0, out: { code: 'no_tier', params: {} } };
    if (need === 0) return { ...base, risk, out: { code: 'not_needed', params: { tier: d.tier } } };
    if (!d.population) return { ...base, risk: 0, out: { code: 'no_population', params: {} } };
    if (d.lat === null || d.lon === null) return { ...base, risk, out: { code: 'no_location', params: {} } };
    if (input.teams.length === 0) return { ...base, risk, out: { code: 'no_teams', params: {} } };
    const trained = input.teams.filter((t) => t.kinds.some((k) => work.includes(k)));
    if (trained.length === 0) return { ...base, risk, out: { code: 'no_trained_team', params: { kinds: work } } };
    const reach = trained.flatMap((team) => {
      const b = byId.get(team.baseDistrictId);
      if (!b || b.lat === null || b.lon === null) return [];
      return [{ team, km: distanceKm(b.lat, b.lon, d.lat!, d.lon!) }];
    });
    const eligible = reach.filter((r) => r.km <= input.maxTravelKm && (capacity.get(r.team.id) ?? 0) > 0);
    if (eligible.length === 0) {
      const nearest = Math.min(...reach.map((r) => r.km));
      return { ...base, risk, out: { code: 'out_of_reach', params: { nearestKm: Number.isFinite(nearest) ? round(nearest) : -1, limitKm: input.maxTravelKm } } };
    }
    return { ...base, risk, eligible, out: null };
  });
  return { prepared, capacity };
}

/** Lay the solved district-days onto the week's days and word every district's reason. */
function finish(input: ProposalInput, prepared: Prepared[], capacity: Map<string, number>, days: Map<string, Map<string, number>>, method: Proposal['method']): Proposal {
  const teamName = new Map(input.teams.map((t) => [t.id, t.name]));
  const assignments: PlannedDay[] = [];
  const rankOf = new Map(prepared.map((p) => [p.d.id, p.d.rank]));
  for (const team of input.teams) {
    const own = [...(days.get(team.id) ?? new Map<string, number>()).entries()].filter(([, n]) => n > 0).sort(([a], [b]) => rankOf.get(a)! - rankOf.get(b)!);
    let i = 0;
    for (const [districtId, n] of own) for (let k = 0; k < n; k++) assignments.push({ teamId: team.id, districtId, day: input.days[i++] });
  }
  let coveredRisk = 0;
  let totalRisk = 0;
  const districts = prepared.map((p): DistrictDecision => {
    const planned = assignments.filter((a) => a.districtId === p.d.id);
    const daysPlanned = planned.length;
    if (p.need > 0) totalRisk += p.risk; // risk is 0 where it cannot be measured (no tier, no population)
    coveredRisk += p.need > 0 ? (p.risk * Math.min(daysPlanned, p.need)) / p.need : 0;
    const teams = [...new Set(planned.map((a) => teamName.get(a.teamId)!))];
    const reason = p.out
      ?? (daysPlanned >= p.need ? { code: 'planned' as const, params: { days: daysPlanned, teams } }
        : daysPlanned > 0 ? { code: 'partly_planned' as const, params: { days: daysPlanned, needed: p.need, teams } }
        : { code: 'capacity_spent' as const, params: { teams: p.eligible.map((e) => e.team.name) } });
    return { districtId: p.d.id, rank: p.d.rank, tier: p.d.tier, risk: p.risk, daysNeeded: p.need, daysPlanned, workNeeded: p.work, reason };
  });
  return {
    assignments,
    districts,
    teams: input.teams.map((t) => ({ teamId: t.id, capacity: capacity.get(t.id) ?? 0, daysPlanned: assignments.filter((a) => a.teamId === t.id).length })),
    coveredRisk,
    totalRisk,
    method,
    visitWeight: VISIT_WEIGHT,
  };
}

/** The proposal: the mixed-integer program above, solved by javascript-lp-solver. */
export function proposeFieldWeek(input: ProposalInput): Proposal {
  const { prepared, capacity } = prepare(input);
  const variables: Record<string, Record<string, number>> = {};
  const ints: Record<string, 1> = {};
  const constraints: Record<string, { max: number }> = {};
  const keyOf = new Map<string, { teamId: string; districtId: string }>();
  prepared.forEach((p, di) => {
    if (p.out) return;
    constraints[`d${di}`] = { max: p.need };
    for (const { team } of p.eligible) {
      const ti = input.teams.indexOf(team);
      constraints[`t${ti}`] = { max: capacity.get(team.id)! };
      const v = `x_${ti}_${di}`;
      variables[v] = { risk: p.risk / p.need, [`t${ti}`]: 1, [`d${di}`]: 1 };
      ints[v] = 1;
      keyOf.set(v, { teamId: team.id, districtId: p.d.id });
    }
  });
  const days = new Map<string, Map<string, number>>();
  if (keyOf.size > 0) {
    const result = solver.Solve({ optimize: 'risk', opType: 'max', constraints, variables, ints }) as Record<string, number | boolean>;
    for (const [v, ref] of keyOf) {
      const n = Math.round(Number(result[v] ?? 0));
      if (n <= 0) continue;
      const m = days.get(ref.teamId) ?? new Map<string, number>();
      m.set(ref.districtId, n);
      days.set(ref.teamId, m);
    }
  }
  return finish(input, prepared, capacity, days, 'milp');
}

/**
 * The plan an officer would make by hand, for comparison: each team in turn takes the highest districts
 * of the Ladder it may serve (same training and travel rules) until its days run out.
 */
export function ladderOrderPlan(input: ProposalInput): Proposal {
  const { prepared, capacity } = prepare(input);
  const left = new Map(capacity);
  const needLeft = new Map(prepared.map((p) => [p.d.id, p.need]));
  const days = new Map<string, Map<string, number>>();
  for (const team of input.teams) {
    for (const p of prepared) {
      if (p.out || !p.eligible.some((e) => e.team.id === team.id)) continue;
      const n = Math.min(left.get(team.id)!, needLeft.get(p.d.id)!);
      if (n <= 0) continue;
      left.set(team.id, left.get(team.id)! - n);
      needLeft.set(p.d.id, needLeft.get(p.d.id)! - n);
      const m = days.get(team.id) ?? new Map<string, number>();
      m.set(p.d.id, n);
      days.set(team.id, m);
    }
  }
  return finish(input, prepared, capacity, days, 'ladder-order');
}
