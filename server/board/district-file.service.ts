import type { DistrictFileResponse } from '../../shared/api/board.schema';
import { computeSeasonColumns, findProfile, formatIsoDate, getProfile, parseIsoDate, weeksInYear } from '../../shared/model';
import { SeasonRepository } from '../season/season.repository';
import { aggregateLarvalIndices } from '../../shared/signals';
import { buildSignals, CHANNEL_LOOKBACK_YEARS } from '../cases/case-signals';
import { currentWeek, firstOpenWeek, todayIn } from '../cases/case-weeks';
import type { AppContext } from '../app-context';
import { assertDistrictVisible, type Principal } from '../auth/principal';
import { notFound } from '../http/errors';
import { presentAssignment } from '../profiles/profiles.presenter';
import { ProfilesRepository } from '../profiles/profiles.repository';


/** Everything the District file shows, in one answer, from stored data (no recomputation). */
export class DistrictFileService {
  constructor(private readonly ctx: AppContext) {}

  async file(p: Principal, districtId: string, season?: number): Promise<DistrictFileResponse> {
    assertDistrictVisible(p, districtId);
    const q = this.ctx.ds.query.bind(this.ctx.ds);
    const [district] = await q(
      `SELECT id, code, name, is_demo AS "isDemo", centroid_lat AS lat, centroid_lon AS lon FROM districts WHERE id = $1`,
      [districtId],
    );
    if (!district) throw notFound('The district');
    const seasonsRows: { y: number }[] = await q(
      `SELECT DISTINCT extract(year FROM date)::int AS y FROM district_weather_days WHERE district_id = $1
       UNION SELECT DISTINCT epi_year FROM district_tiers WHERE district_id = $1
       UNION SELECT DISTINCT epi_year FROM case_counts WHERE district_id = $1 ORDER BY 1 DESC`,
      [districtId],
    );
    const seasons = seasonsRows.map((r) => r.y);
    const seasonYear = season ?? seasons[0] ?? new Date().getUTCFullYear();
    const from = `${seasonYear}-01-01`;
    const to = `${seasonYear}-12-31`;

    const [weatherRows, sourceRows, clockRows, caseRows, surveyRows, tierRows, excludedRows, assignmentRows, closureRows] = await Promise.all([
      q(`SELECT to_char(date, 'YYYY-MM-DD') AS date, tmin, tmax, rh, rain, filled FROM district_weather_days
          WHERE district_id = $1 AND date BETWEEN $2 AND $3 ORDER BY date`, [districtId, from, to]),
      q(`SELECT s.method, s.distance_km, s.weight, st.code FROM district_weather_sources s JOIN weather_stations st ON st.id = s.station_id
          WHERE s.district_id = $1 ORDER BY s.weight DESC`, [districtId]),
      // The stored seasons (one row of arrays per profile and season) given back as one row per day.
      q(`SELECT s.profile_id, to_char(s.start_date + (u.i - 1)::int, 'YYYY-MM-DD') AS date, u.cumulative_degree_days, u.generations,
                u.eip_days, u.survival_through_eip, u.rvc, u.rvc_low, u.rvc_high, u.season_open, u.complete
           FROM vector_clock_seasons s,
                unnest(s.cumulative_degree_days, s.generations, s.eip_days, s.survival_through_eip, s.rvc, s.rvc_low, s.rvc_high,
                       s.season_open, s.complete) WITH ORDINALITY
                  AS u(cumulative_degree_days, generations, eip_days, survival_through_eip, rvc, rvc_low, rvc_high, season_open, complete, i)
          WHERE s.district_id = $1 AND s.season_year BETWEEN extract(year FROM $2::date) AND extract(year FROM $3::date)
            AND s.start_date + (u.i - 1)::int BETWEEN $2::date AND $3::date
          ORDER BY s.profile_id, s.start_date + (u.i - 1)::int`, [districtId, from, to]),
      q(`SELECT c.disease_id, d.name AS disease_name, c.epi_year, c.epi_week, c.cases FROM case_counts c JOIN diseases d ON d.id = c.disease_id
          WHERE c.district_id = $1 AND c.epi_year BETWEEN $2 AND $3 AND c.voided_at IS NULL`, [districtId, seasonYear - CHANNEL_LOOKBACK_YEARS, seasonYear]),
      q(`SELECT epi_year, epi_week, houses_inspected AS "housesInspected", houses_positive AS "housesPositive",
                containers_inspected AS "containersInspected", containers_positive AS "containersPositive", pupae
           FROM larval_surveys WHERE district_id = $1 AND epi_year = $2 AND voided_at IS NULL ORDER BY epi_year, epi_week`, [districtId, seasonYear]),
      q(`SELECT epi_year, epi_week, tier, tier_low, tier_high, score, confidence, drivers, notes, leading_driver, changed_driver
           FROM district_tiers WHERE district_id = $1 AND epi_year = $2 ORDER BY epi_week`, [districtId, seasonYear]),
      q(`SELECT disease_id, excluded_years FROM case_channel_settings WHERE district_id = $1`, [districtId]),
      new ProfilesRepository(this.ctx.ds).districtAssignment(districtId),
      q(`SELECT epi_week FROM case_week_closures WHERE district_id = $1 AND epi_year = $2`, [districtId, seasonYear]) as Promise<{ epi_week: number }[]>,
    ]);

    const source = sourceRows.length === 0
      ? null
      : sourceRows[0].method === 'inside'
        ? `Stations in the district: ${sourceRows.map((s: { code: string }) => s.code).join(', ')}`
        : `No station inside the district: interpolated from ${sourceRows
            .map((s: { code: string; distance_km: number; weight: number }) => `${s.code} (${Math.round(s.distance_km)} km, weight ${s.weight.toFixed(2)})`)
            .join(', ')}`;

    // A season the runs never stored (an earlier year, chosen or compared with) is computed here from its
    // stored weather with the same model, so "compare heat with 2025" draws a line instead of nothing.
    if (clockRows.length === 0 && weatherRows.length > 0 && district.lat !== null) clockRows.push(...(await this.computedClock(districtId, district.lat, seasonYear)));
    const byProfile = new Map<string, typeof clockRows>();
    for (const r of clockRows) {
      if (!byProfile.has(r.profile_id)) byProfile.set(r.profile_id, []);
      byProfile.get(r.profile_id)!.push(r);
    }

    const excluded = new Map<string, number[]>(excludedRows.map((r: { disease_id: string; excluded_years: number[] }) => [r.disease_id, r.excluded_years]));
    const diseases = new Map<string, { name: string; counts: Map<number, (number | null)[]> }>();
    for (const r of caseRows) {
      if (!diseases.has(r.disease_id)) diseases.set(r.disease_id, { name: r.disease_name, counts: new Map() });
      const years = diseases.get(r.disease_id)!.counts;
      if (!years.has(r.epi_year)) years.set(r.epi_year, []);
      years.get(r.epi_year)![r.epi_week - 1] = r.cases;
    }
    const system = this.ctx.config.EPI_WEEK_SYSTEM;
    const lastWeek = weeksInYear(seasonYear, system);
    const weeks = Array.from({ length: lastWeek }, (_, i) => i + 1);
    // Weeks still open for reporting (deadline not passed, not closed): their counts are partial, and the
    // charts, the print page and the bulletin draw them as incomplete and give them no zone.
    const today = todayIn(this.ctx.config.TIMEZONE);
    const now = currentWeek(system, today);
    const openFrom = seasonYear > now.year ? 1 : seasonYear < now.year - 1 ? null : firstOpenWeek(
      seasonYear, seasonYear === now.year ? now.week : lastWeek, system, this.ctx.config.CASE_REPORT_DEADLINE_DAYS, today,
      new Set(closureRows.map((r) => r.epi_week)),
    );
    // The channel exactly as the district cases page draws it (the case ledger's signals).
    const cases = [...diseases.entries()].map(([diseaseId, d]) => {
      const signals = buildSignals({
        year: seasonYear, lastWeek, weeksInTargetYear: lastWeek, counts: d.counts, excludedYears: excluded.get(diseaseId) ?? [],
        method: this.ctx.config.CHANNEL_METHOD, cusum: { k: this.ctx.config.CUSUM_K, h: this.ctx.config.CUSUM_H }, population: null, openFrom,
      });
      const band = (f: 'lower' | 'centre' | 'upper') => signals.weeks.map((w) => (w.channel ? round(w.channel[f]) : null));
      const channel = { lower: band('lower'), centre: band('centre'), upper: band('upper'), method: this.ctx.config.CHANNEL_METHOD };
      const priorSeasons = [...d.counts.keys()]
        .filter((y) => y < seasonYear)
        .sort((a, b) => b - a)
        .map((year) => ({ year, counts: weeks.map((w) => d.counts.get(year)![w - 1] ?? null) }));
      return { diseaseId, diseaseName: d.name, weeks, counts: weeks.map((w) => d.counts.get(seasonYear)?.[w - 1] ?? null), channel, priorSeasons, openFrom };
    });

    const larvalByWeek = new Map<string, typeof surveyRows>();
    for (const s of surveyRows) {
      const k = `${s.epi_year}:${s.epi_week}`;
      if (!larvalByWeek.has(k)) larvalByWeek.set(k, []);
      larvalByWeek.get(k)!.push(s);
    }
    const larval = [...larvalByWeek.entries()].map(([k, list]) => {
      const [epiYear, epiWeek] = k.split(':').map(Number);
      const idx = aggregateLarvalIndices(list.map(({ epi_year: _y, epi_week: _w, ...rest }: Record<string, unknown>) => rest) as never);
      return { epiYear, epiWeek, surveys: list.length, pupaSurveys: idx.pupaSurveys, house: idx.house, container: idx.container, breteau: idx.breteau, pupa: idx.pupa };
    });

    return {
      district,
      seasonYear,
      seasons,
      profiles: assignmentRows.map(presentAssignment),
      weather: {
        dates: weatherRows.map((r: { date: string }) => r.date),
        tmin: weatherRows.map((r: { tmin: number | null }) => r.tmin),
        tmax: weatherRows.map((r: { tmax: number | null }) => r.tmax),
        rh: weatherRows.map((r: { rh: number | null }) => r.rh),
        rain: weatherRows.map((r: { rain: number | null }) => r.rain),
        filled: weatherRows.map((r: { filled: boolean }) => r.filled),
        source,
      },
      vectorClock: [...byProfile.entries()].map(([profileId, rows]) => ({
        profileId,
        profileName: findProfile(profileId)?.name ?? profileId,
        dates: rows.map((r: { date: string }) => r.date),
        cumulativeDegreeDays: rows.map((r: { cumulative_degree_days: number }) => r.cumulative_degree_days),
        generations: rows.map((r: { generations: number }) => r.generations),
        eipDays: rows.map((r: { eip_days: number | null }) => r.eip_days),
        survivalThroughEip: rows.map((r: { survival_through_eip: number | null }) => r.survival_through_eip),
        rvc: rows.map((r: { rvc: number | null }) => r.rvc),
        rvcLow: rows.map((r: { rvc_low: number | null }) => r.rvc_low),
        rvcHigh: rows.map((r: { rvc_high: number | null }) => r.rvc_high),
        seasonOpen: rows.map((r: { season_open: boolean }) => r.season_open),
        complete: rows.map((r: { complete: boolean }) => r.complete),
      })),
      cases,
      larval,
      tiers: tierRows.map((t: Record<string, any>) => ({
        epiYear: t.epi_year, epiWeek: t.epi_week, tier: t.tier, tierLow: t.tier_low, tierHigh: t.tier_high, score: t.score,
        confidence: t.confidence, drivers: t.drivers, notes: t.notes, leadingDriver: t.leading_driver, changedDriver: t.changed_driver,
      })),
    };
  }

  /** The vector clock of a season without stored results, from the district's weather of that year (rows as the stored query gives them). */
  private async computedClock(districtId: string, lat: number, seasonYear: number) {
    const profiles = await new ProfilesRepository(this.ctx.ds).biofixes(districtId);
    if (profiles.length === 0) return [];
    const weather = (await new SeasonRepository(this.ctx.ds).weather([districtId], `${seasonYear}-01-01`, `${seasonYear}-12-31`)).get(districtId);
    if (!weather || weather.rows === 0) return [];
    const out: Record<string, unknown>[] = [];
    const num = (x: number) => (Number.isNaN(x) ? null : x);
    const start = parseIsoDate(weather.startDate);
    for (const { profile_id: profileId, biofix } of profiles) {
      if (!findProfile(profileId)) continue;
      const c = computeSeasonColumns(getProfile(profileId), { lat, biofix: biofix ? `${seasonYear}-${biofix}` : undefined }, weather);
      for (let i = 0; i < c.length; i++) {
        out.push({
          profile_id: profileId, date: formatIsoDate(start + i), cumulative_degree_days: num(c.cumulativeDegreeDays[i]), generations: num(c.generations[i]),
          eip_days: num(c.eipDays[i]), survival_through_eip: num(c.survivalThroughEip[i]), rvc: num(c.relativeVectorialCapacity[i]),
          rvc_low: num(c.relativeVectorialCapacityLow[i]), rvc_high: num(c.relativeVectorialCapacityHigh[i]),
          season_open: c.seasonOpen[i] === 1, complete: c.complete[i] === 1,
        });
      }
    }
    return out;
  }
}

const round = (x: number) => Math.round(x * 100) / 100;
