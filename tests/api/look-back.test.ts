import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { LookBackService } from '../../server/skill/look-back.service';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeUser, signedInAgent } from '../support/factories';
import { makeSeasonDistrict } from '../support/season-factories';

let t: TestApp;
let districts: { id: string }[];
let diseaseId: string;
const TODAY = '2026-12-05';

/**
 * Weekly counts of one district for 2019–2025: a low seasonal level, with an epidemic in weeks 26–36 of
 * the `epidemics` years (invented data, written straight to the table without revisions: imported history).
 */
async function seasonsOfCases(ds: DataSource, districtId: string, epidemics: number[]) {
  for (let y = 2019; y <= 2025; y++) {
    const bump = epidemics.includes(y) ? 40 : 0;
    await ds.query(
      `INSERT INTO case_counts (district_id, disease_id, epi_year, epi_week, cases, reported_at, updated_at)
       SELECT $1, $2, $3, w, 3 + (w % 4) + CASE WHEN w BETWEEN 26 AND 36 THEN $4 ELSE 0 END,
              '2019-01-01'::timestamptz, now()
         FROM generate_series(1, 52) AS w`,
      [districtId, diseaseId, y, bump],
    );
  }
}

async function waitForRun(agent: Awaited<ReturnType<typeof signedInAgent>>, id: string) {
  for (let i = 0; i < 600; i++) {
    const res = await agent.get(`/api/look-back/runs/${id}`);
    expect(res.status).toBe(200);
    if (res.body.status !== 'running') return res.body;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error('the Look-back did not finish');
}

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  const [disease] = await t.ds.query(`INSERT INTO diseases (code, name, profile_ids) VALUES ('LBK', 'Look-back disease', '{}') RETURNING id`);
  diseaseId = disease.id;
  districts = [];
  for (const [i, epidemics] of [[2021, 2024], [2022, 2025]].entries()) {
    const d = await makeSeasonDistrict(t.ds, { from: '2021-01-01', to: '2025-12-31', warmth: i });
    await seasonsOfCases(t.ds, d.id, epidemics);
    districts.push(d);
  }
});
afterAll(() => t.close());

describe('the Look-back', () => {
  it('when an epidemiologist starts a Look-back over a small region, then it answers 202, replays every district-week apart from the live tiers, and its scores can be read', async () => {
    const epi = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'epidemiologist' })).email);
    const liveBefore = await countRows(t.ds, 'district_tiers');
    const res = await epi.post('/api/look-back/runs').send({ fromYear: 2025, toYear: 2025 });
    expect(res.status).toBe(202);
    expect(res.body.id).toMatch(/^[0-9a-f-]{36}$/);
    const run = await waitForRun(epi, res.body.id);
    expect(run.status).toBe('succeeded');
    expect(run.districtsTotal).toBe(2);
    expect(run.districtsDone).toBe(2);
    expect(run.districtsFailed).toBe(0);
    expect(run.byPerson).toBe(true);
    // 2025 has 53 MMWR weeks (2026's week 1 starts on 4 January), all ended by the deployment's today.
    expect(run.weeksWritten).toBe(2 * 53);
    const [{ n }] = await t.ds.query(`SELECT count(*)::int AS n FROM look_back_weeks WHERE run_id = $1`, [run.id]);
    expect(n).toBe(106);
    expect(await countRows(t.ds, 'district_tiers')).toEqual(liveBefore);

    const list = await epi.get('/api/look-back/runs');
    expect(list.body.runs.map((r: { id: string }) => r.id)).toContain(run.id);

    // An officer reads the scores: overall, 12 lead times, the tier beside the three null models on the same weeks.
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    const overall = await officer.get(`/api/look-back/runs/${run.id}/scores`);
    expect(overall.status).toBe(200);
    expect(overall.body.warnAt).toBe('high');
    expect(overall.body.groups).toHaveLength(1);
    const leads = overall.body.groups[0].leads;
    expect(leads.map((l: { lead: number }) => l.lead)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
    for (const l of leads) {
      expect(l.pairs).toBeGreaterThan(0);
      for (const model of ['tier', 'climatology', 'persistence', 'channel']) {
        const table = l[model].table;
        // Every model is scored on the same pairs of weeks.
        expect(table.hits + table.falseAlarms + table.misses + table.correctNegatives).toBe(l.pairs);
        if (l[model].hitRate !== null) expect(l[model].hitRate).toBeGreaterThanOrEqual(0);
        if (l[model].hitRate !== null) expect(l[model].hitRate).toBeLessThanOrEqual(1);
      }
    }
    // The epidemic weeks (26–36 of 2025 in the second district) are events, so lead 1 has some.
    expect(leads[0].tier.table.hits + leads[0].tier.table.misses).toBeGreaterThan(0);

    const one = await officer.get(`/api/look-back/runs/${run.id}/scores`).query({ level: 'district', districtId: districts[1].id, lead: 3, warnAt: 'raised' });
    expect(one.status).toBe(200);
    expect(one.body.groups).toHaveLength(1);
    expect(one.body.groups[0]).toMatchObject({ level: 'district', id: districts[1].id, districts: 1 });
    expect(one.body.groups[0].leads.map((l: { lead: number }) => l.lead)).toEqual([3]);
    const byRegion = await officer.get(`/api/look-back/runs/${run.id}/scores`).query({ level: 'region', lead: 1 });
    expect(byRegion.status).toBe(200);
    expect(byRegion.body.groups[0].districts).toBe(2);
  }, 240_000);

  it('when a body or a query is bad, then the answer is 400 naming the field and nothing is written', async () => {
    const admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
    const before = await countRows(t.ds, 'look_back_runs', 'look_back_weeks');
    const cases: [unknown, string][] = [
      [{}, 'fromYear'],
      [{ fromYear: 2025 }, 'toYear'],
      [{ fromYear: '2025', toYear: 2025 }, 'fromYear'],
      [{ fromYear: 2024.5, toYear: 2025 }, 'fromYear'],
      [{ fromYear: 2025, toYear: 2020 }, 'toYear'],
      [{ fromYear: 2010, toYear: 2025 }, 'toYear'],
      [{ fromYear: 2024, toYear: 2025, districts: [] }, 'districts'],
      [{ fromYear: 2030, toYear: 2030 }, 'fromYear'], // no finished week yet
    ];
    for (const [body, field] of cases) {
      const res = await admin.post('/api/look-back/runs').send(body as object);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(JSON.stringify(res.body.error.fields ?? []), JSON.stringify(body)).toContain(field);
    }
    expect(await countRows(t.ds, 'look_back_runs', 'look_back_weeks')).toEqual(before);

    const [{ id }] = await t.ds.query(`SELECT id FROM look_back_runs LIMIT 1`);
    for (const [query, field] of [
      [{ lead: 13 }, 'lead'], [{ lead: 0 }, 'lead'], [{ lead: 'soon' }, 'lead'], [{ level: 'country' }, 'level'],
      [{ districtId: districts[0].id }, 'districtId'], [{ level: 'district', districtId: 'x' }, 'districtId'], [{ warnAt: 'baseline' }, 'warnAt'],
    ] as [Record<string, unknown>, string][]) {
      const res = await admin.get(`/api/look-back/runs/${id}/scores`).query(query);
      expect(res.status, JSON.stringify(query)).toBe(400);
      expect(JSON.stringify(res.body.error.fields), JSON.stringify(query)).toContain(field);
    }
    expect((await admin.get(`/api/look-back/runs/00000000-0000-4000-8000-000000000000`)).status).toBe(404);
  });

  it('when a count arrives after its week, then the replay of the weeks before its arrival ignores it, and the weeks after see it', async () => {
    const service = new LookBackService(t.ctx);
    const district = districts[0];
    // Without the count of week 40 of 2025 (it ends on 4 October) …
    await t.ds.query(`DELETE FROM case_counts WHERE district_id = $1 AND epi_year = 2025 AND epi_week = 40`, [district.id]);
    const first = await service.runNow({ fromYear: 2025, toYear: 2025, requestedBy: null, today: TODAY });
    expect(first!.status).toBe('succeeded');
    // … then it is first reported long after the week, on 2025-10-15 (in week 42), and corrected upward the next day.
    const [count] = await t.ds.query(
      `INSERT INTO case_counts (district_id, disease_id, epi_year, epi_week, cases, reported_at, updated_at, version, late)
       VALUES ($1, $2, 2025, 40, 400, '2025-10-15T12:00:00Z', '2025-10-16T12:00:00Z', 2, true) RETURNING id`,
      [district.id, diseaseId],
    );
    await t.ds.query(
      `INSERT INTO case_count_revisions (case_count_id, version, at, kind, source, old_values, new_values)
       VALUES ($1, 1, '2025-10-15T12:00:00Z', 'entry', 'form', NULL, '{"cases": 90}'),
              ($1, 2, '2025-10-16T12:00:00Z', 'correction', 'form', '{"cases": 90}', '{"cases": 400}')`,
      [count.id],
    );
    const second = await service.runNow({ fromYear: 2025, toYear: 2025, requestedBy: null, today: TODAY });
    expect(second!.status).toBe('succeeded');
    const read = (runId: string) =>
      t.ds.query(`SELECT to_char(as_of, 'YYYY-MM-DD') AS as_of, tier, score, drivers FROM look_back_weeks WHERE run_id = $1 AND district_id = $2 ORDER BY as_of`, [runId, district.id]);
    const [a, b] = [await read(first!.id), await read(second!.id)];
    expect(b).toHaveLength(a.length);
    const before = a.filter((w: { as_of: string }) => w.as_of < '2025-10-15');
    expect(before.length).toBeGreaterThan(30);
    for (let i = 0; i < before.length; i++) expect(b[i]).toEqual(a[i]); // no look-ahead
    // Not blind: once the count was known, some later week's replay differs.
    const after = a.map((w: unknown, i: number) => [w, b[i]]).filter(([w]: any) => w.as_of >= '2025-10-17');
    expect(after.some(([x, y]: any) => JSON.stringify(x) !== JSON.stringify(y))).toBe(true);
  }, 240_000);

  it('when one district fails to replay, then it is named in a warning and the others are replayed', async () => {
    const service = new LookBackService(t.ctx);
    const run = await service.runNow({
      fromYear: 2025, toYear: 2025, requestedBy: null, today: TODAY,
      districtHook: (id) => { if (id === districts[0].id) throw new Error('bad data'); },
    });
    expect(run!.status).toBe('succeeded');
    expect(run!.districtsDone).toBe(2);
    expect(run!.warnings).toEqual([expect.objectContaining({ code: 'district_failed', districtId: districts[0].id, reason: { code: 'unexpected_error', params: { kind: 'Error' } } })]);
    const rows = await t.ds.query(`SELECT DISTINCT district_id FROM look_back_weeks WHERE run_id = $1`, [run!.id]);
    expect(rows.map((r: { district_id: string }) => r.district_id)).toEqual([districts[1].id]);
  }, 240_000);
});
