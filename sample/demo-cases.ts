/**
 * Invented weekly cases and larval surveys for the invented Halvern Region (docs/product.md § The demo region), seasons
 * 2020–2026, generated reproducibly from a seed. Nothing here is real.
 *
 * - coast (HV-01…03): dengue, peaking in the late wet season, with an epidemic in 2022;
 * - valley (HV-04…06): vivax malaria, and some falciparum, with an epidemic in 2024;
 * - plateau and highlands (HV-07…12): West Nile virus, small counts in late summer only (Culex in diapause
 *   through the winter), with a raised year in 2023.
 * The current season runs to the last full week before today; Saltmere's dengue climbs above its channel
 * in the last weeks, so the District file has something to show.
 */
import type { EntityManager } from 'typeorm';
import { CaseChannelSettingEntity } from '../server/cases/case-channel-setting.entity';
import { CaseCountEntity } from '../server/cases/case-count.entity';
import { CaseDistrictSettingEntity } from '../server/cases/case-district-setting.entity';
import { CaseWeekClosureEntity } from '../server/cases/case-week-closure.entity';
import { DiseaseEntity } from '../server/cases/disease.entity';
import { LarvalSurveyEntity } from '../server/cases/larval-survey.entity';
import { currentWeek, deadlineOf, todayIn, weekRef } from '../server/cases/case-weeks';
import { UserEntity } from '../server/users/user.entity';
import { epiWeek, weeksInYear, type EpiWeekSystem } from '../shared/model/epi-week';
import { buildDemoRegion, DEMO_SEED, type DemoZone } from './demo-region';
import { seededRandom } from './random';

export const DEMO_CASE_YEARS = [2020, 2021, 2022, 2023, 2024, 2025, 2026];
/** Days after a week's end the demo counts usually arrive (the default deadline is 3). */
const REPORT_LAG_DAYS = 2;

interface Series {
  disease: 'DENV' | 'MAL-PV' | 'MAL-PF' | 'WNV';
  /** Mean weekly cases at the seasonal peak, for a district of the zone's base population. */
  peak: number;
  /** Week of the peak and the spread of the season (weeks). */
  peakWeek: number;
  spread: number;
  /** Off-season floor as a share of the peak (0 for West Nile: no transmission in diapause). */
  floor: number;
  epidemics: Record<number, number>;
}

const SERIES: Record<DemoZone, Series[]> = {
  coast: [{ disease: 'DENV', peak: 30, peakWeek: 38, spread: 7, floor: 0.05, epidemics: { 2022: 4 } }],
  valley: [
    { disease: 'MAL-PV', peak: 14, peakWeek: 30, spread: 8, floor: 0.08, epidemics: { 2024: 2.5 } },
    { disease: 'MAL-PF', peak: 3, peakWeek: 33, spread: 6, floor: 0.02, epidemics: { 2024: 2 } },
  ],
  plateau: [{ disease: 'WNV', peak: 3, peakWeek: 34, spread: 4, floor: 0, epidemics: { 2023: 3 } }],
  highlands: [{ disease: 'WNV', peak: 1, peakWeek: 33, spread: 3, floor: 0, epidemics: { 2023: 2.5 } }],
};

/** Years left out of each zone's channel as epidemic years (the per-district/disease setting). */
const EXCLUDED: Partial<Record<DemoZone, Partial<Record<Series['disease'], number[]>>>> = {
  coast: { DENV: [2022] },
  valley: { 'MAL-PV': [2024], 'MAL-PF': [2024] },
};

/** A Poisson draw: Knuth's method for small means, a rounded normal for large ones (enough for invented data). */
function poisson(random: () => number, mean: number): number {
  if (mean <= 0) return 0;
  if (mean < 30) {
    const limit = Math.exp(-mean);
    let k = 0;
    let p = random();
    while (p > limit) {
      k += 1;
      p *= random();
    }
    return k;
  }
  const u = Math.max(random(), 1e-12);
  const z = Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * random());
  return Math.max(0, Math.round(mean + Math.sqrt(mean) * z));
}

/** A UUID (version 4 layout) from the seeded generator, so demo survey ids are the same on every machine. */
function seededUuid(random: () => number): string {
  const hex = Array.from({ length: 32 }, () => Math.floor(random() * 16).toString(16));
  hex[12] = '4';
  hex[16] = ((parseInt(hex[16], 16) & 0x3) | 0x8).toString(16);
  const s = hex.join('');
  return `${s.slice(0, 8)}-${s.slice(8, 12)}-${s.slice(12, 16)}-${s.slice(16, 20)}-${s.slice(20)}`;
}

export interface DemoCount {
  districtCode: string;
  disease: Series['disease'];
  year: number;
  week: number;
  cases: number;
  confirmed: number | null;
  probable: number | null;
  /** YYYY-MM-DD the count arrived. */
  reportedOn: string;
  late: boolean;
}

const addDays = (iso: string, days: number) => {
  const d = new Date(`${iso}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
};

/** Every demo count up to the last full week before `today`; reproducible from the seed. */
export function buildDemoCases(today: string, system: EpiWeekSystem, seed = DEMO_SEED, deadlineDays = 3): DemoCount[] {
  const random = seededRandom(seed + 5);
  const now = currentWeek(system, today);
  const out: DemoCount[] = [];
  for (const district of buildDemoRegion()) {
    const scale = district.populations[0].population / ({ coast: 240_000, valley: 160_000, plateau: 90_000, highlands: 35_000 }[district.zone]);
    for (const s of SERIES[district.zone]) {
      for (const year of DEMO_CASE_YEARS) {
        const n = weeksInYear(year, system);
        const yearFactor = (s.epidemics[year] ?? 1) * (0.8 + random() * 0.4);
        for (let week = 1; week <= n; week++) {
          if (year > now.year || (year === now.year && week >= now.week)) break;
          const distance = (week - s.peakWeek) / s.spread;
          let mean = s.peak * scale * yearFactor * (s.floor + (1 - s.floor) * Math.exp(-0.5 * distance * distance));
          // This season, Saltmere's dengue rises early and stays high: a count above its channel.
          if (district.code === 'HV-01' && year === now.year && week >= now.week - 6) mean *= 2.2;
          const cases = poisson(random, mean);
          const ref = weekRef(year, week, system);
          const lateDraw = random() < 0.06;
          const reportedOn = addDays(ref.end, lateDraw ? deadlineDays + 2 + Math.floor(random() * 5) : 1 + Math.floor(random() * REPORT_LAG_DAYS));
          if (reportedOn > today) continue; // not reported yet
          const confirmed = s.disease === 'DENV' ? Math.round(cases * (0.3 + random() * 0.2)) : null;
          out.push({
            districtCode: district.code,
            disease: s.disease,
            year,
            week,
            cases,
            confirmed,
            probable: confirmed === null ? null : cases - confirmed,
            reportedOn,
            late: reportedOn > deadlineOf(year, week, system, deadlineDays),
          });
        }
      }
    }
  }
  return out;
}

const LOCALITIES = ['Harbour Row', 'Gullsend', 'Tidemark Lane', 'Old Saltworks', 'Reedgate'];

/**
 * Load the demo cases, week closures, channel settings and a few larval surveys for Saltmere, inside the
 * caller's transaction (seedDemoIfEmpty). `byCode` maps district codes to the ids just saved.
 */
export async function loadDemoCases(
  manager: EntityManager,
  byCode: Map<string, string>,
  opts: { system?: EpiWeekSystem; today?: string; deadlineDays?: number } = {},
): Promise<void> {
  const system = opts.system ?? ((process.env.EPI_WEEK_SYSTEM as EpiWeekSystem | undefined) === 'iso' ? 'iso' : 'mmwr');
  const today = opts.today ?? todayIn(process.env.TIMEZONE ?? 'UTC');
  const deadlineDays = opts.deadlineDays ?? 3;
  const diseases = new Map((await manager.find(DiseaseEntity)).map((d) => [d.code, d.id]));
  const region = buildDemoRegion();

  await manager.insert(CaseDistrictSettingEntity, region.map((d) => ({ districtId: byCode.get(d.code)!, activeFrom: '2019-01-01' })));
  const settings = region.flatMap((d) =>
    Object.entries(EXCLUDED[d.zone] ?? {}).map(([code, years]) => ({
      districtId: byCode.get(d.code)!, diseaseId: diseases.get(code)!, excludedYears: years!, updatedAt: new Date(), updatedBy: null,
    })),
  );
  if (settings.length) await manager.insert(CaseChannelSettingEntity, settings);

  const counts = buildDemoCases(today, system, DEMO_SEED, deadlineDays);
  const rows = counts.map((c) => {
    const at = new Date(`${c.reportedOn}T09:00:00Z`);
    return {
      districtId: byCode.get(c.districtCode)!, diseaseId: diseases.get(c.disease)!, epiYear: c.year, epiWeek: c.week, cases: c.cases,
      confirmed: c.confirmed, probable: c.probable, ageBands: null, version: 1, reportedAt: at, reportedBy: null, late: c.late, updatedAt: at,
    };
  });
  for (let i = 0; i < rows.length; i += 1000) await manager.insert(CaseCountEntity, rows.slice(i, i + 1000));
  // Each demo count's first revision, so the history of every count starts with its entry.
  await manager.query(
    `INSERT INTO case_count_revisions (case_count_id, version, at, actor_id, kind, source, old_values, new_values, reason)
     SELECT id, 1, reported_at, NULL, 'entry', 'demo', NULL,
            jsonb_build_object('cases', cases, 'confirmed', confirmed, 'probable', probable, 'ageBands', age_bands), NULL
       FROM case_counts WHERE district_id = ANY($1)`,
    [[...byCode.values()]],
  );

  // Weeks are closed once their deadline has passed, except the last three, still open for late reports.
  const now = currentWeek(system, today);
  const closures: { districtId: string; epiYear: number; epiWeek: number; closedAt: Date; closedBy: null }[] = [];
  for (const d of region) {
    for (const year of DEMO_CASE_YEARS) {
      for (let week = 1; week <= weeksInYear(year, system); week++) {
        if (year > now.year || (year === now.year && week >= now.week - 3)) break;
        const closedOn = addDays(deadlineOf(year, week, system, deadlineDays), 1);
        if (closedOn >= today) continue;
        closures.push({ districtId: byCode.get(d.code)!, epiYear: year, epiWeek: week, closedAt: new Date(`${closedOn}T12:00:00Z`), closedBy: null });
      }
    }
  }
  for (let i = 0; i < closures.length; i += 1000) await manager.insert(CaseWeekClosureEntity, closures.slice(i, i + 1000));

  // A few larval surveys in Saltmere over the last four weeks, by the demo community worker.
  const worker = await manager.findOneBy(UserEntity, { email: 'worker@halvern.example' });
  const random = seededRandom(DEMO_SEED + 11);
  const surveys = Array.from({ length: 8 }, (_, i) => {
    const date = addDays(today, -3 - i * 3);
    const houses = 40 + Math.floor(random() * 60);
    const housesPositive = Math.floor(houses * (0.08 + random() * 0.12));
    const containers = houses * 3 + Math.floor(random() * 40);
    const containersPositive = housesPositive + Math.floor(random() * housesPositive);
    const w = epiWeek(date, system);
    return {
      id: seededUuid(random), districtId: byCode.get('HV-01')!, locality: LOCALITIES[i % LOCALITIES.length], surveyDate: date,
      epiYear: w.year, epiWeek: w.week, housesInspected: houses, housesPositive, containersInspected: containers, containersPositive,
      pupae: housesPositive * (2 + Math.floor(random() * 4)), containerTypes: ['drum or barrel', 'bucket or jar', 'tyre'].slice(0, 1 + (i % 3)),
      notes: null, submittedBy: worker?.id ?? null, submittedAt: new Date(`${date}T15:00:00Z`),
    };
  });
  await manager.insert(LarvalSurveyEntity, surveys);
}
