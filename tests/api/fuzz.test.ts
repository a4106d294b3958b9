import fc from 'fast-check';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeDistrict, makeUser, signedInAgent } from '../support/factories';
import { createTestApp, type TestApp } from '../support/test-app';

/**
 * Fuzzing the API's inputs (issue 8): generated bodies, path parameters and query strings sent to the
 * write routes and the main reads, as each role that may use them. No answer may be a 500, and a
 * refused request (4xx) must leave every table as it was. fast-check, 300 cases per property: a bounded
 * amount of work (1,200 cases took over two minutes on a busy two-core machine and timed out), new
 * cases on every run (no fixed seed).
 */
let t: TestApp;
const agents: Record<'admin' | 'officer' | 'epidemiologist' | 'supervisor', ReturnType<typeof request.agent>> = {} as never;
let districtId: string;
let diseaseId: string;
let countTables: string;

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '100000', SIGN_IN_LIMIT_PER_ACCOUNT: '100000' });
  const district = await makeDistrict(t.ds);
  districtId = district.id;
  await t.ds.query(`INSERT INTO case_district_settings (district_id, active_from) VALUES ($1, '2015-01-01')`, [districtId]);
  [{ id: diseaseId }] = await t.ds.query(`INSERT INTO diseases (code, name) VALUES ('FUZZ', 'Fuzz fever') RETURNING id`);
  for (const role of ['admin', 'officer', 'epidemiologist', 'supervisor'] as const) {
    const user = await makeUser(t.ds, { role, districtIds: role === 'epidemiologist' ? [districtId] : [] });
    agents[role] = await signedInAgent(t.app, user.email);
  }
  const tables: { name: string }[] = await t.ds.query(
    `SELECT tablename AS name FROM pg_tables WHERE schemaname = 'public' AND tablename <> 'migrations' ORDER BY tablename`,
  );
  countTables = `SELECT ${tables.map((x) => `(SELECT count(*) FROM "${x.name}")`).join(' || \',\' || ')} AS c`;
});
afterAll(async () => {
  await t.close();
});

const snapshot = async (): Promise<string> => (await t.ds.query(countTables))[0].c;

// ---- generators ----
const weird = fc.oneof(
  fc.constant(null), fc.constant(''), fc.constant(-1), fc.constant(0), fc.constant(1e308), fc.constant(-0.5), fc.constant(2 ** 53),
  fc.constant('NaN'), fc.constant('1'), fc.constant('2025-02-30'), fc.constant('<script>'), fc.constant("' OR 1=1 --"),
  fc.constant('\u0000'), fc.constant('é'.repeat(600)), fc.constant([]), fc.constant({}), fc.constant(true),
  fc.integer(), fc.double(), fc.string(), fc.uuid(), fc.jsonValue({ maxDepth: 2 }),
);
/** A valid-looking object with some fields replaced by odd values, some removed, or an unknown one added. */
const spoil = (valid: () => Record<string, unknown>) =>
  fc.tuple(fc.array(fc.tuple(fc.nat(20), weird), { maxLength: 3 }), fc.boolean(), fc.string({ maxLength: 12 }), weird).map(([edits, drop, extra, extraValue]) => {
    const v = valid();
    const keys = Object.keys(v);
    for (const [i, value] of edits) v[keys[i % keys.length]] = value;
    if (drop && edits.length) delete v[keys[edits[0][0] % keys.length]];
    if (extra) v[extra] = extraValue;
    return v;
  });
const validCase = () => ({ diseaseId, year: 2025, week: 10, cases: 4, confirmed: 1, probable: 1, ageBands: { '0-4': 1 }, reason: 'fuzz entry', source: 'form' });
const body = (valid: () => Record<string, unknown>) => fc.oneof(
  { weight: 4, arbitrary: spoil(valid).map((b) => ({ json: b })) },
  { weight: 2, arbitrary: fc.jsonValue({ maxDepth: 3 }).map((b) => ({ json: b })) },
  { weight: 1, arbitrary: fc.string({ maxLength: 200 }).map((raw) => ({ raw })) },
);
const idParam = fc.oneof(fc.constant('__district__'), fc.uuid(), fc.string({ maxLength: 40 }).map(encodeURIComponent), fc.constant('..%2F..'), fc.constant('%00'));

interface Target { role: keyof typeof agents; method: 'post' | 'put' | 'patch'; path: string; valid: () => Record<string, unknown> }
const targets: Target[] = [
  { role: 'epidemiologist', method: 'put', path: '/api/districts/:id/cases', valid: validCase },
  { role: 'epidemiologist', method: 'post', path: '/api/districts/:id/weeks/close', valid: () => ({ year: 2025, week: 10 }) },
  { role: 'epidemiologist', method: 'post', path: '/api/districts/:id/weeks/reopen', valid: () => ({ year: 2025, week: 10, reason: 'closed by mistake' }) },
  { role: 'epidemiologist', method: 'put', path: '/api/districts/:id/channel-settings', valid: () => ({ diseaseId, excludedYears: [2020] }) },
  { role: 'admin', method: 'post', path: '/api/diseases', valid: () => ({ code: 'ZZ-1', name: 'Zed', profileIds: [] }) },
  { role: 'admin', method: 'patch', path: '/api/districts/:id', valid: () => ({ name: 'Renamed district' }) },
  { role: 'admin', method: 'put', path: '/api/districts/:id/populations', valid: () => ({ populations: [{ year: 2025, population: 1000 }] }) },
  { role: 'admin', method: 'put', path: '/api/districts/:id/boundary', valid: () => ({ boundary: { type: 'Polygon', coordinates: [[[0, 0], [1, 0], [1, 1], [0, 0]]] } }) },
  { role: 'admin', method: 'post', path: '/api/users', valid: () => ({ email: 'new@fuzz.example', displayName: 'New', role: 'worker', districtIds: [districtId] }) },
  { role: 'admin', method: 'put', path: '/api/tier-settings', valid: () => ({ settings: {}, reason: 'fuzz' }) },
  { role: 'officer', method: 'post', path: '/api/flags', valid: () => ({ districtId, reason: 'manual', note: 'fuzz flag' }) },
  { role: 'officer', method: 'put', path: '/api/subscriptions/me', valid: () => ({ districts: [{ districtId, advisory: true, bulletin: false }] }) },
  { role: 'officer', method: 'patch', path: '/api/me/preferences', valid: () => ({ language: 'fr' }) },
  { role: 'officer', method: 'post', path: '/api/weather/stations', valid: () => ({ code: 'FZ1', name: 'Fuzz', latitude: 1, longitude: 2 }) },
  { role: 'officer', method: 'put', path: '/api/weather/observations', valid: () => ({ station: 'FZ1', date: '2025-01-01', tmin: 10, tmax: 20, reason: 'fuzz' }) },
  { role: 'officer', method: 'post', path: '/api/surveys', valid: () => ({ districtId, date: '2025-01-01', housesInspected: 10, housesPositive: 1 }) },
  { role: 'supervisor', method: 'post', path: '/api/flags/:id/approve', valid: () => ({ note: 'ok' }) },
  { role: 'supervisor', method: 'post', path: '/api/flags/:id/reject', valid: () => ({ reason: 'no' }) },
];

async function send(target: Target, id: string, input: { json?: unknown; raw?: string }) {
  const path = target.path.replace(':id', id === '__district__' ? districtId : id);
  const req = agents[target.role][target.method](path);
  // JSON primitives (a bare number, string, null) go as raw text: supertest sends only objects as JSON.
  const raw = input.raw ?? (input.json === null || typeof input.json !== 'object' ? JSON.stringify(input.json) : undefined);
  return raw !== undefined ? req.set('content-type', 'application/json').send(raw) : req.send(input.json as object);
}

describe('fuzzing the API', () => {
  it('when generated bodies and path ids reach the write routes, then no answer is a 500 and a refused request writes nothing', async () => {
    const seenStatuses = new Map<number, number>();
    await fc.assert(
      fc.asyncProperty(
        fc.nat(targets.length - 1).chain((i) => fc.tuple(fc.constant(targets[i]), idParam, body(targets[i].valid))),
        async ([target, id, input]) => {
          const before = await snapshot();
          const res = await send(target, id, input);
          seenStatuses.set(res.status, (seenStatuses.get(res.status) ?? 0) + 1);
          expect(res.status, `${target.method} ${target.path} ${JSON.stringify(input).slice(0, 300)} → ${JSON.stringify(res.body).slice(0, 300)}`).toBeLessThan(500);
          if (res.status >= 400) {
            expect(res.body?.error?.code, 'a refusal carries its code').toEqual(expect.any(String));
            expect(await snapshot(), `${target.method} ${target.path} answered ${res.status} but wrote`).toBe(before);
          }
        },
      ),
      // Each route's valid body runs once as well, so an acceptance is always among the cases (with
      // 300 generated cases alone, a run without any 2xx happened by chance).
      { numRuns: 300, examples: targets.map((tg) => [[tg, '__district__', { json: tg.valid() }]] as [[Target, string, { json: Record<string, unknown> }]]) },
    );
    // The generators reach both refusals and acceptances.
    expect([...seenStatuses.keys()].some((s) => s === 400)).toBe(true);
    expect([...seenStatuses.keys()].some((s) => s < 300)).toBe(true);
  }, 120_000);

  it('when generated query strings reach the reads, then no answer is a 500', async () => {
    const reads = ['/api/cases/grid', `/api/districts/${'__district__'}/cases`, '/api/districts/__district__/file', '/api/board', '/api/outbox', '/api/weather/uploads', '/api/flags'];
    const query = fc.dictionary(
      fc.oneof(fc.constantFrom('diseaseId', 'weeks', 'scope', 'year', 'season', 'status', 'limit', 'districtId', 'page'), fc.string({ maxLength: 8 })),
      fc.oneof(fc.constant(diseaseId), fc.string({ maxLength: 20 }), fc.integer().map(String), fc.constantFrom('mine', 'all', 'pending', '-1', '1e9', '')),
      { maxKeys: 4 },
    );
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...reads), fc.constantFrom('officer', 'epidemiologist', 'supervisor', 'admin') as fc.Arbitrary<keyof typeof agents>, query, async (path, role, q) => {
        const res = await agents[role].get(path.replace('__district__', districtId)).query(q);
        expect(res.status, `${role} GET ${path}?${new URLSearchParams(q)} → ${JSON.stringify(res.body).slice(0, 300)}`).toBeLessThan(500);
      }),
      { numRuns: 300 },
    );
  }, 120_000);
});
