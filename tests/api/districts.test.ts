import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';
import { ALL_TABLES, countRows, makeDistrict, makeUser, signedInAgent, square } from '../support/factories';

let t: TestApp;
let admin: Awaited<ReturnType<typeof signedInAgent>>;
beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
});
afterAll(() => t.close());

describe('districts', () => {
  it('when an admin creates a district, sets a population and uploads a boundary, then the district shows all three', async () => {
    const created = await admin.post('/api/districts').send({ code: 'NEW-1', name: 'New district' });
    expect(created.status).toBe(201);
    const id = created.body.id;
    const pop = await admin.put(`/api/districts/${id}/populations`).send({ year: 2026, population: 52_000 });
    expect(pop.body.populations).toEqual([{ year: 2026, population: 52_000 }]);
    const feature = { type: 'Feature', properties: { name: 'x' }, geometry: square(30, 10, 2) };
    const boundary = await admin.put(`/api/districts/${id}/boundary`).send(feature);
    expect(boundary.status).toBe(200);
    expect(boundary.body.hasBoundary).toBe(true);
    expect(boundary.body.centroid.lat).toBeCloseTo(11, 5);
    expect(boundary.body.centroid.lon).toBeCloseTo(31, 5);
    const map = await admin.get('/api/districts/boundaries');
    expect(map.body.features.find((f: { id: string }) => f.id === id).geometry.type).toBe('Polygon');
  });

  it('when a district has a malaria profile, then its listing names that profile, so its cases page opens on its own disease', async () => {
    const d = await makeDistrict(t.ds);
    await t.ds.query("INSERT INTO district_profiles (district_id, profile_id, biofix) VALUES ($1, 'anopheles-falciparum', NULL)", [d.id]);
    const one = await admin.get(`/api/districts/${d.id}`);
    expect(one.body.profileIds).toEqual(['anopheles-falciparum']);
    const diseases = await admin.get('/api/diseases');
    const own = diseases.body.diseases.filter((x: { profileIds: string[] }) => x.profileIds.includes('anopheles-falciparum'));
    expect(own.length).toBeGreaterThan(0);
    expect(own.map((x: { code: string }) => x.code)).not.toContain('DENV');
  });

  it('when a boundary is not polygons, then the answer is 400 naming the problem and nothing is written', async () => {
    const district = await makeDistrict(t.ds);
    const before = await countRows(t.ds, ...ALL_TABLES);
    const point = await admin.put(`/api/districts/${district.id}/boundary`).send({ type: 'Point', coordinates: [1, 2] });
    expect(point.status).toBe(400);
    expect(point.body.error.message).toMatch(/Polygon/);
    const open = await admin.put(`/api/districts/${district.id}/boundary`).send({
      type: 'Polygon', coordinates: [[[0, 0], [1, 0], [1, 1], [0, 1]]],
    });
    expect(open.status).toBe(400);
    expect(open.body.error.fields[0].path).toMatch(/^coordinates/);
    const outOfRange = await admin.put(`/api/districts/${district.id}/boundary`).send(square(200, 10));
    expect(outOfRange.status).toBe(400);
    expect(await countRows(t.ds, ...ALL_TABLES)).toEqual(before);
  });

  it('when a code is taken or a population is not a whole number, then the answer is 4xx naming it and nothing is written', async () => {
    const district = await makeDistrict(t.ds);
    const before = await countRows(t.ds, ...ALL_TABLES);
    expect((await admin.post('/api/districts').send({ code: district.code, name: 'Twin' })).status).toBe(409);
    const pop = await admin.put(`/api/districts/${district.id}/populations`).send({ year: 2026, population: 12.5 });
    expect(pop.status).toBe(400);
    expect(pop.body.error.fields[0].path).toBe('population');
    const code = await admin.post('/api/districts').send({ code: 'lower case', name: 'Bad' });
    expect(code.body.error.fields[0].path).toBe('code');
    expect(await countRows(t.ds, ...ALL_TABLES)).toEqual(before);
  });

  it('when a community worker asks for districts, then only their own come back and another one is refused', async () => {
    const own = await makeDistrict(t.ds);
    const other = await makeDistrict(t.ds);
    const worker = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'worker', districtIds: [own.id] })).email);
    const list = await worker.get('/api/districts');
    expect(list.body.districts.map((d: { id: string }) => d.id)).toEqual([own.id]);
    expect((await worker.get(`/api/districts/${other.id}`)).status).toBe(403);
    expect((await worker.get(`/api/districts/${own.id}`)).status).toBe(200);
    const map = await worker.get('/api/districts/boundaries');
    expect(map.body.features.map((f: { id: string }) => f.id)).toEqual([own.id]);
  });
});
