import negativeBinomialRandom from '@stdlib/random-base-negative-binomial';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { DataSource } from 'typeorm';
import { epiWeekEnd, weeksInYear } from '../../shared/model';
import { districtOutlookResponse } from '../../shared/api/outlook.schema';
import { seededRandom } from '../../shared/stats/random';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeUser, signedInAgent } from '../support/factories';
import { makeSeasonDistrict } from '../support/season-factories';

/**
 * GET /api/districts/:id/outlook (docs/outlook.md). Counts are invented: a seasonal negative binomial
 * process with an autoregressive term, drawn with a seeded generator, so the answers are the same on
 * every machine. The clock is fixed at 2026-12-05 (a Saturday: MMWR week 48 of 2026 has just ended).
 */
let t: TestApp;
let seasonal: { id: string };
let short: { id: string };
let diseaseId: string;
const NOW = new Date('2026-12-05T12:00:00Z');

async function seasonalCounts(ds: DataSource, districtId: string, fromYear: number, seed: number) {
  const draw = negativeBinomialRandom.factory({ prng: seededRandom(seed) });
  let prev = 3;
  const rows: string[] = [];
  for (let y = fromYear; y <= 2026; y++) {
    for (let w = 1; w <= weeksInYear(y, 'mmwr'); w++) {
      if (epiWeekEnd(y, w, 'mmwr') > '2026-12-05') break;
      const mu = Math.exp(0.8 + 1.1 * Math.sin((2 * Math.PI * (w - 14)) / 52) + 0.45 * Math.log(prev + 1));
      prev = draw(5, 5 / (5 + mu));
      rows.push(`('${districtId}', '${diseaseId}', ${y}, ${w}, ${prev}, now(), now())`);
    }
  }
  await ds.query(`INSERT INTO case_counts (district_id, disease_id, epi_year, epi_week, cases, reported_at, updated_at) VALUES ${rows.join(',')}`);
}

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  const [disease] = await t.ds.query(`INSERT INTO diseases (code, name, profile_ids) VALUES ('OUT', 'Outlook disease', '{aedes-aegypti-dengue}') RETURNING id`);
  diseaseId = disease.id;
  seasonal = await makeSeasonDistrict(t.ds, { from: '2019-01-01', to: '2026-12-05' });
  await seasonalCounts(t.ds, seasonal.id, 2019, 42);
  short = await makeSeasonDistrict(t.ds, { from: '2026-01-01', to: '2026-12-05' });
  await seasonalCounts(t.ds, short.id, 2026, 7);
});
afterAll(() => {
  vi.useRealTimers();
  return t.close();
});

describe('the Case outlook', () => {
  it('when an epidemiologist reads the outlook of a district with eight seasons of seasonal counts, then it has skill per week ahead, and a fan only for the weeks ahead that beat the null', async () => {
    const epi = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'epidemiologist', districtIds: [seasonal.id] })).email);
    vi.useFakeTimers({ toFake: ['Date'], now: NOW });
    const before = await countRows(t.ds, 'case_counts');
    const started = performance.now();
    const res = await epi.get(`/api/districts/${seasonal.id}/outlook`);
    const took = performance.now() - started;
    expect(res.status).toBe(200);
    const body = districtOutlookResponse.parse(res.body);
    expect(body.status).toBe('ok');
    expect(body.disease?.id).toBe(diseaseId);
    expect(body.origin).toMatchObject({ year: 2026, week: 48 });
    expect(body.skill!.horizons).toHaveLength(8);
    expect(body.model!.drivers).toContain('rvc');
    expect(body.forecast).toHaveLength(body.fanHorizons);
    for (const h of body.skill!.horizons) if (h.horizon <= body.fanHorizons) expect(h.beatsNull).toBe(true);
    // A seasonal process with a strong yearly cycle and persistence: the first week ahead beats the climatology.
    expect(body.fanHorizons).toBeGreaterThan(0);
    for (const f of body.forecast) {
      expect(f.q10).toBeLessThanOrEqual(f.q25);
      expect(f.q25).toBeLessThanOrEqual(f.q50);
      expect(f.q50).toBeLessThanOrEqual(f.q75);
      expect(f.q75).toBeLessThanOrEqual(f.q90);
    }
    expect(body.forecast[0]).toMatchObject({ horizon: 1, year: 2026, week: 49 });
    expect(body.recent.at(-1)).toMatchObject({ year: 2026, week: 48 });
    expect(await countRows(t.ds, 'case_counts')).toEqual(before);
    // Measured, not asserted (machine speed varies): the first answer computes, the second is cached.
    const again = performance.now();
    const res2 = await epi.get(`/api/districts/${seasonal.id}/outlook?disease=${diseaseId}`);
    console.info(`outlook: computed in ${Math.round(took)} ms, cached answer in ${Math.round(performance.now() - again)} ms`);
    expect(res2.body.forecast).toEqual(body.forecast);
    vi.useRealTimers();
  });

  it('when a district has one season of counts, then the outlook says too little data and sends no forecast', async () => {
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    vi.useFakeTimers({ toFake: ['Date'], now: NOW });
    const res = await officer.get(`/api/districts/${short.id}/outlook`);
    vi.useRealTimers();
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'too_little_data', fanHorizons: 0, forecast: [] });
  });

  it('when a community worker asks for a district that is not theirs, then 403', async () => {
    const worker = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'worker', districtIds: [short.id] })).email);
    const res = await worker.get(`/api/districts/${seasonal.id}/outlook`);
    expect(res.status).toBe(403);
  });

  it('when the disease is not an id or not known, then 400 naming the field', async () => {
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    const bad = await officer.get(`/api/districts/${seasonal.id}/outlook?disease=dengue`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields[0].path).toBe('disease');
    const unknown = await officer.get(`/api/districts/${seasonal.id}/outlook?disease=00000000-0000-4000-8000-000000000000`);
    expect(unknown.status).toBe(400);
    expect(unknown.body.error).toMatchObject({ code: 'unknown_disease', fields: [{ path: 'disease' }] });
  });

  it('when a district has no counts at all, then the outlook says so', async () => {
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    const none = await makeSeasonDistrict(t.ds, {});
    const res = await officer.get(`/api/districts/${none.id}/outlook`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'no_cases', disease: null, forecast: [] });
  });
});
