import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeDistrict, makeUser, signedInAgent } from '../support/factories';
import { CASES_TABLES } from '../support/cases-factories';

type Agent = Awaited<ReturnType<typeof signedInAgent>>;

let t: TestApp;
let own: { id: string };
let other: { id: string };
let worker: Agent;
let officer: Agent;

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  own = await makeDistrict(t.ds);
  other = await makeDistrict(t.ds);
  worker = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'worker', districtIds: [own.id] })).email);
  officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
});
afterAll(() => t.close());

const rows = () => countRows(t.ds, ...CASES_TABLES);
const survey = (overrides: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  districtId: own.id,
  locality: 'Harbour ward',
  date: '2026-03-10',
  housesInspected: 200,
  housesPositive: 30,
  containersInspected: 600,
  containersPositive: 45,
  pupae: 80,
  containerTypes: ['drum or barrel', 'tyre'],
  ...overrides,
});

describe('larval surveys', () => {
  it('when a community worker submits a survey for their district, then it is stored with its indices; the same id again answers 200 with the same survey and writes nothing', async () => {
    const body = survey();
    const first = await worker.post('/api/surveys').send(body);
    expect(first.status).toBe(201);
    // WHO definitions; 200 houses, 30 positive, 600 containers, 45 positive → HI 15 %, CI 7.5 %, BI 22.5 [derived, CHECK-VALUES.md].
    expect(first.body.indices.house).toBeCloseTo(15, 9);
    expect(first.body.indices.container).toBeCloseTo(7.5, 9);
    expect(first.body.indices.breteau).toBeCloseTo(22.5, 9);
    expect(first.body.indices.pupa).toBeCloseTo(40, 9);
    const before = await rows();
    const again = await worker.post('/api/surveys').send(body);
    expect(again.status).toBe(200);
    expect(again.body).toEqual(first.body);
    expect(await rows()).toEqual(before);
  });

  it('when a survey has more positive houses than houses inspected, negative or fractional counts, or a future date, then it is refused naming the field and nothing is written', async () => {
    const before = await rows();
    const cases = [
      [{ housesPositive: 201 }, 'housesPositive'],
      [{ containersInspected: -1 }, 'containersInspected'],
      [{ pupae: 2.5 }, 'pupae'],
      [{ containersPositive: 700 }, 'containersPositive'],
      [{ date: '2999-01-01' }, 'date'],
    ] as const;
    for (const [overrides, field] of cases) {
      const res = await worker.post('/api/surveys').send(survey(overrides));
      expect(res.status, JSON.stringify(overrides)).toBe(400);
      expect(res.body.error.fields.map((f: { path: string }) => f.path)).toContain(field);
    }
    expect(await rows()).toEqual(before);
  });

  it('when a community worker submits for a district not theirs, then it is refused; a health officer may submit for any district', async () => {
    const before = await rows();
    expect((await worker.post('/api/surveys').send(survey({ districtId: other.id }))).status).toBe(403);
    expect(await rows()).toEqual(before);
    expect((await officer.post('/api/surveys').send(survey({ districtId: other.id }))).status).toBe(201);
  });

  it('when a repeated id names another district, then it is refused as taken rather than showing that survey', async () => {
    const body = survey({ districtId: other.id });
    expect((await officer.post('/api/surveys').send(body)).status).toBe(201);
    const res = await officer.post('/api/surveys').send({ ...body, districtId: own.id });
    expect(res.status).toBe(409);
  });

  it('when a district has several surveys in a week, then the week’s indices pool the counts rather than average the surveys', async () => {
    const d = await makeDistrict(t.ds);
    const w = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'worker', districtIds: [d.id] })).email);
    const base = { districtId: d.id, date: '2026-05-12', containersInspected: 300, pupae: null };
    await w.post('/api/surveys').send(survey({ ...base, housesInspected: 50, housesPositive: 20, containersPositive: 25 }));
    await w.post('/api/surveys').send(survey({ ...base, housesInspected: 150, housesPositive: 10, containersPositive: 12, date: '2026-05-13' }));
    const res = await officer.get(`/api/districts/${d.id}/surveys`);
    expect(res.status).toBe(200);
    expect(res.body.surveys).toHaveLength(2);
    // Pooled HI 30 / 200 = 15 %, not the mean of 40 % and 6.7 % (docs/signals.md, "Aggregation" [derived]).
    expect(res.body.weeks).toHaveLength(1);
    expect(res.body.weeks[0].indices.house).toBeCloseTo(15, 9);
    expect(res.body.weeks[0].indices.pupa).toBeNull();
    expect((await worker.get(`/api/districts/${d.id}/surveys`)).status).toBe(403);
  });
});
