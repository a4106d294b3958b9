import type { BoardResponse, LadderRow } from '../../shared/api/board.schema';
import { tierRank } from '../../shared/tier';
import type { BoardRowRecord } from './board.repository';

/** Ranked by tier, then score, then code; districts the run has not reached yet come last, saying so. */
export function presentBoard(records: BoardRowRecord[]): BoardResponse {
  const withTier = records.find((r) => r.tier !== null);
  const rows = records
    .map((r): Omit<LadderRow, 'rank'> => ({
      districtId: r.district_id,
      code: r.code,
      name: r.name,
      isDemo: r.is_demo,
      region: r.region_id ? { id: r.region_id, code: r.region_code ?? '', name: r.region_name ?? '' } : null,
      tier: (r.tier ?? 'baseline') as LadderRow['tier'],
      tierLow: (r.tier_low ?? r.tier ?? 'baseline') as LadderRow['tier'],
      tierHigh: (r.tier_high ?? r.tier ?? 'baseline') as LadderRow['tier'],
      score: r.score ?? 0,
      tierChange: r.tier && r.prev_tier ? tierRank(r.tier as never) - tierRank(r.prev_tier as never) : null,
      scoreChange: r.score !== null && r.prev_score !== null ? Math.round((r.score - r.prev_score) * 10_000) / 10_000 : null,
      leadingDriver: r.leading_driver as LadderRow['leadingDriver'],
      changedDriver: r.changed_driver as LadderRow['changedDriver'],
      confidence: (r.tier ? r.confidence : 'insufficient') as LadderRow['confidence'],
      casesThisWeek: r.cases_this_week,
      casesWeek: r.cases_epi_year !== null && r.cases_epi_week !== null ? { year: r.cases_epi_year, week: r.cases_epi_week } : null,
      casesDiseases: r.cases_diseases ?? [],
      channelZone: r.channel_zone as LadderRow['channelZone'],
      latestWeather: r.latest_weather,
      profileId: r.profile_id,
    }))
    .sort((a, b) =>
      Number(b.confidence !== 'insufficient') - Number(a.confidence !== 'insufficient') ||
      tierRank(b.tier) - tierRank(a.tier) || b.score - a.score || a.code.localeCompare(b.code))
    .map((row, i) => ({ ...row, rank: i + 1 }));
  return {
    epiYear: withTier?.epi_year ?? null,
    epiWeek: withTier?.epi_week ?? null,
    asOf: withTier?.as_of ?? null,
    computedAt: withTier?.computed_at ? new Date(withTier.computed_at).toISOString() : null,
    rows,
  };
}
