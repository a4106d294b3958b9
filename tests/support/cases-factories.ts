import type { DataSource } from 'typeorm';
import { CaseCountEntity } from '../../server/cases/case-count.entity';
import { CaseDistrictSettingEntity } from '../../server/cases/case-district-setting.entity';
import { DiseaseEntity } from '../../server/cases/disease.entity';
import { currentWeek, todayIn, weeksEndingWith } from '../../server/cases/case-weeks';
import type { EpiWeekSystem } from '../../shared/model/epi-week';
import { makeDistrict } from './factories';

/** Tables of the Case ledger and surveys, for counting rows before and after bad input. */
export const CASES_TABLES = [
  'case_counts', 'case_count_revisions', 'case_week_closures', 'case_channel_settings', 'case_district_settings',
  'larval_surveys', 'diseases', 'audit_events',
];

/** A district that has reported to the ledger since `activeFrom` (a factory district is created today). */
export async function makeReportingDistrict(ds: DataSource, activeFrom = '2015-01-01') {
  const district = await makeDistrict(ds);
  await ds.getRepository(CaseDistrictSettingEntity).insert({ districtId: district.id, activeFrom });
  return district;
}

/** One of the base diseases of the migration (DENV, MAL-PV, MAL-PF, WNV). */
export async function disease(ds: DataSource, code: 'DENV' | 'MAL-PV' | 'MAL-PF' | 'WNV' = 'DENV') {
  return ds.getRepository(DiseaseEntity).findOneByOrFail({ code });
}

/** Counts written straight to the table (history for the signals), without revisions. */
export async function insertCounts(ds: DataSource, districtId: string, diseaseId: string, rows: { year: number; week: number; cases: number }[]) {
  const now = new Date();
  if (rows.length === 0) return;
  await ds.getRepository(CaseCountEntity).insert(
    rows.map((r) => ({ districtId, diseaseId, epiYear: r.year, epiWeek: r.week, cases: r.cases, reportedAt: now, updatedAt: now, version: 1, late: false })),
  );
}

/**
 * The week `back` weeks before the current one (0 = this week), in the test deployment's system. It reads
 * today's date: in weeks 1–6 it falls in the previous year and the reporting deadline moves with the
 * weekday, so a test whose answer depends on it fixes the clock first (`vi.useFakeTimers({ toFake: ['Date'],
 * now })` after signing in; tests/api/cases.test.ts) or uses the week only as a key it reads back by year.
 */
export function weeksAgo(back: number, system: EpiWeekSystem = 'mmwr') {
  const weeks = weeksEndingWith(currentWeek(system, todayIn('UTC')), back + 1, system);
  return weeks[0];
}
