import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runSeasonNow } from '../../server/season/season-run.service';
import { createTestApp, type TestApp } from '../support/test-app';
import { makeCaseHistory, makeSeasonDistrict } from '../support/season-factories';

/*
 * A season run dated in the past reads the weeks as they stood on its as-of date (issue 16, item 5, "weeks
 * have a state"): a week closed *after* that date was still open then, with a partial count, and is not read
 * as complete. As of Monday 17 August 2026 (MMWR week 33), week 32 (9–15 August) is open until its
 * reporting deadline on 18 August (3 days); week 31 is the newest complete week.
 */
const AS_OF = '2026-08-17';

let t: TestApp;
let closedLater: { id: string };
let closedBefore: { id: string };

beforeAll(async () => {
  t = await createTestApp();
  closedLater = await makeSeasonDistrict(t.ds, { warmth: 2 });
  closedBefore = await makeSeasonDistrict(t.ds, { warmth: 2 });
  // The same counts in both: 3 a week, then week 32 with 200.
  const current = Array.from({ length: 32 }, (_, i) => (i === 31 ? 200 : 3));
  for (const d of [closedLater, closedBefore]) await makeCaseHistory(t.ds, d.id, { base: 2, year: 2026, current });
  // Week 32 closed a week after the as-of date in one district, the day before it in the other.
  await t.ds.query(`INSERT INTO case_week_closures (district_id, epi_year, epi_week, closed_at) VALUES ($1, 2026, 32, '2026-08-24T09:00:00Z')`, [closedLater.id]);
  await t.ds.query(`INSERT INTO case_week_closures (district_id, epi_year, epi_week, closed_at) VALUES ($1, 2026, 32, '2026-08-16T09:00:00Z')`, [closedBefore.id]);
});
afterAll(() => t.close());

const casesWeek = async (districtId: string) => {
  const [row] = await t.ds.query(
    `SELECT epi_year, epi_week, cases_epi_year, cases_epi_week FROM district_tiers WHERE district_id = $1 ORDER BY computed_at DESC LIMIT 1`,
    [districtId],
  );
  return row as { epi_year: number; epi_week: number; cases_epi_year: number | null; cases_epi_week: number | null };
};

describe('a season run dated in the past', () => {
  it('when a week was closed after the run’s as-of date, then the run reads it as open (the newest complete week is the one before); closed before, it counts as complete', async () => {
    const run = await runSeasonNow(t.ctx, { asOf: AS_OF });
    expect(run!.status).toBe('succeeded');
    const later = await casesWeek(closedLater.id);
    expect(later).toMatchObject({ epi_year: 2026, epi_week: 33, cases_epi_year: 2026, cases_epi_week: 31 });
    const before = await casesWeek(closedBefore.id);
    expect(before).toMatchObject({ epi_year: 2026, epi_week: 33, cases_epi_year: 2026, cases_epi_week: 32 });
  });
});
