import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeUser, signedInAgent, square } from '../support/factories';
import { csv } from '../support/weather-factories';

let t: TestApp;
let admin: Awaited<ReturnType<typeof signedInAgent>>;
const TABLES = ['districts', 'regions', 'district_populations', 'weather_stations', 'audit_events'];

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
});
afterAll(() => t.close());

/** A row of `n` one-degree squares from (lon, lat), each a district of region `region`. */
const squares = (prefix: string, n: number, lon: number, lat: number, region = 'R1') => ({
  type: 'FeatureCollection',
  features: Array.from({ length: n }, (_, i) => ({
    type: 'Feature',
    properties: { ID: `${prefix}-${i + 1}`, NAME: `${prefix} district ${i + 1}`, PARENT: region, PARENT_NAME: `Region ${region}`, POP: 10_000 * (i + 1) },
    geometry: square(lon + i, lat),
  })),
});
/** A ring that crosses itself (a "bow-tie"). */
const bowTie = { type: 'Polygon', coordinates: [[[0, 0], [1, 1], [1, 0], [0, 1], [0, 0]]] };

const importDistricts = (file: object | string, query = '', fields: Record<string, string> = {}, name = 'districts.geojson') => {
  let req = admin.post(`/api/districts/import${query}`);
  for (const [k, v] of Object.entries({ codeProperty: 'ID', nameProperty: 'NAME', parentCodeProperty: 'PARENT', parentNameProperty: 'PARENT_NAME', ...fields }))
    req = req.field(k, v);
  return req.attach('file', Buffer.from(typeof file === 'string' ? file : JSON.stringify(file)), name);
};

describe('district import', () => {
  it('when an admin imports a GeoJSON file as a dry run, then the report counts what would be created and nothing is written', async () => {
    const before = await countRows(t.ds, ...TABLES);
    const res = await importDistricts(squares('DRY', 3, 40, 10), '?dryRun=true');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ dryRun: true, total: 3, created: 3, updated: 0, skipped: 0, problems: [], regions: { created: 1, updated: 0 } });
    expect(res.body.properties).toEqual(['ID', 'NAME', 'PARENT', 'PARENT_NAME', 'POP']);
    expect(res.body.preview[0]).toMatchObject({ code: 'DRY-1', name: 'DRY district 1', region: 'R1', action: 'create' });
    expect(await countRows(t.ds, ...TABLES)).toEqual(before);
  });

  it('when a feature crosses itself, then the import is refused with its index, code and reason and nothing is written', async () => {
    const file = squares('BAD', 3, 50, 10);
    (file.features[1] as { geometry: object }).geometry = bowTie;
    const before = await countRows(t.ds, ...TABLES);
    const res = await importDistricts(file);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('import_rejected');
    expect(res.body.report.problems).toEqual([expect.objectContaining({ index: 1, code: 'BAD-2', rule: 'boundary_self_intersecting' })]);
    // Only the rule and its parameters travel: the client words them (no English sentence from the server).
    expect(res.body.report.problems[0]).not.toHaveProperty('reason');
    expect(res.body.report.problems[0].params).toMatchObject({ points: expect.any(Number), lon: expect.any(Number), lat: expect.any(Number) });
    expect(await countRows(t.ds, ...TABLES)).toEqual(before);
    // A dry run gives the same report with 200 and writes nothing either.
    const dry = await importDistricts(file, '?dryRun=true');
    expect(dry.status).toBe(200);
    expect(dry.body).toMatchObject({ created: 2, skipped: 1 });
    expect(await countRows(t.ds, ...TABLES)).toEqual(before);
  });

  it('when a file has a missing code, a repeated code and a non-polygon, then each is a problem naming its feature', async () => {
    const file = squares('MIX', 4, 60, 10);
    delete (file.features[0].properties as Record<string, unknown>).ID;
    file.features[2].properties.ID = 'MIX-2';
    (file.features[3] as { geometry: object }).geometry = { type: 'Point', coordinates: [63, 10] };
    const res = await importDistricts(file, '?dryRun=true');
    expect(res.body.problems.map((p: { index: number; rule: string }) => [p.index, p.rule])).toEqual([
      [0, 'code_missing'], [2, 'code_repeated'], [3, 'geometry_invalid'],
    ]);
  });

  it('when the problems are skipped on purpose, then the good features are imported and the bad one is listed', async () => {
    const file = squares('SKIP', 3, 70, 10, 'R7');
    (file.features[2] as { geometry: object }).geometry = bowTie;
    const res = await importDistricts(file, '?skipProblems=true');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ created: 2, skipped: 1, problems: [expect.objectContaining({ index: 2, code: 'SKIP-3' })] });
    const rows = await t.ds.query(`SELECT d.code, r.code AS region FROM districts d JOIN regions r ON r.id = d.region_id WHERE d.code LIKE 'SKIP-%' ORDER BY d.code`);
    expect(rows).toEqual([{ code: 'SKIP-1', region: 'R7' }, { code: 'SKIP-2', region: 'R7' }]);
  });

  it('when the same codes are imported again with new names, then they are updated by code, not duplicated, and audited', async () => {
    const first = await importDistricts(squares('UPD', 2, 80, 10, 'R8'), '', { populationProperty: 'POP', populationYear: '2024' });
    expect(first.body).toMatchObject({ created: 2, updated: 0 });
    const file = squares('UPD', 2, 80, 10, 'R8');
    file.features[0].properties.NAME = 'Renamed district';
    file.features[0].properties.POP = 12_345;
    const again = await importDistricts(file, '', { populationProperty: 'POP', populationYear: '2024' });
    expect(again.body).toMatchObject({ created: 0, updated: 2, regions: { created: 0, updated: 1 } });
    const [row] = await t.ds.query(`SELECT d.id, d.name, d.display_boundary IS NOT NULL AS has_display, p.population
      FROM districts d JOIN district_populations p ON p.district_id = d.id AND p.year = 2024 WHERE d.code = 'UPD-1'`);
    expect(row).toMatchObject({ name: 'Renamed district', has_display: true, population: 12_345 });
    expect(Number((await t.ds.query(`SELECT count(*) FROM districts WHERE code LIKE 'UPD-%'`))[0].count)).toBe(2);
    const audit = await t.ds.query(`SELECT action, before->>'name' AS before_name FROM audit_events WHERE entity_id = $1 ORDER BY id`, [row.id]);
    expect(audit).toEqual([
      { action: 'district.imported-created', before_name: null },
      { action: 'district.imported-updated', before_name: 'UPD district 1' },
    ]);
  });

  it('when a TopoJSON topology is imported, then its features are read with topojson-client and the map serves the simplified geometry', async () => {
    const { topology } = await import('topojson-server');
    const topo = topology({ d: squares('TOPO', 2, 90, 10, 'R9') as never });
    const res = await importDistricts(topo, '', {}, 'districts.topojson');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ created: 2, problems: [] });
    const map = await admin.get('/api/districts/boundaries');
    const f = map.body.features.find((x: { properties: { code: string } }) => x.properties.code === 'TOPO-1');
    expect(f.geometry.type).toBe('Polygon');
    const regions = await admin.get('/api/regions');
    expect(regions.body.regions.find((r: { code: string }) => r.code === 'R9')).toMatchObject({ name: 'Region R9', districtCount: 2 });
  });

  it('when the file is not GeoJSON, or the code property is not named, then the answer is 400 naming the field and nothing is written', async () => {
    const before = await countRows(t.ds, ...TABLES);
    const notJson = await importDistricts('{"type": "Feat', '');
    expect(notJson.status).toBe(400);
    expect(notJson.body.error).toMatchObject({ code: 'import_not_json', fields: [expect.objectContaining({ path: 'file' })] });
    const noCode = await admin.post('/api/districts/import').field('nameProperty', 'NAME')
      .attach('file', Buffer.from(JSON.stringify(squares('X', 1, 0, 0))), 'd.geojson');
    expect(noCode.status).toBe(400);
    expect(noCode.body.error.fields.map((f: { path: string }) => f.path)).toContain('codeProperty');
    const noFile = await admin.post('/api/districts/import').field('codeProperty', 'ID').field('nameProperty', 'NAME');
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.code).toBe('file_missing');
    expect(await countRows(t.ds, ...TABLES)).toEqual(before);
  });

  it('when longitude and latitude are swapped in one feature, then it is a problem and the others are fine', async () => {
    const file = squares('SWAP', 4, 58, 40);
    file.features[3].geometry = square(40, 60); // written latitude, longitude: it belongs at (60, 40), beside the others
    const res = await importDistricts(file, '?dryRun=true');
    expect(res.body.problems).toEqual([expect.objectContaining({ index: 3, rule: 'boundary_coordinates_swapped' })]);
  });
});

describe('station and population imports', () => {
  const STATIONS = 'code,name,latitude,longitude,elevation,activeFrom,activeTo';

  it('when an admin imports stations as a dry run and then for real, then the dry run writes nothing and the import places each station in its district', async () => {
    await importDistricts(squares('ST', 2, 120, 10, 'RS'));
    const file = csv(STATIONS, [['ST-A', 'Station A', 10.5, 120.5, 12, '2020-01-01', ''], ['ST-B', 'Station B', 10.5, 121.5, '', '', '']]);
    const before = await countRows(t.ds, ...TABLES);
    const dry = await admin.post('/api/weather/stations/import?dryRun=true').attach('file', Buffer.from(file), 'stations.csv');
    expect(dry.status).toBe(200);
    expect(dry.body).toMatchObject({ dryRun: true, total: 2, created: 2, problems: [] });
    expect(await countRows(t.ds, ...TABLES)).toEqual(before);
    const real = await admin.post('/api/weather/stations/import').attach('file', Buffer.from(file), 'stations.csv');
    expect(real.body).toMatchObject({ created: 2, updated: 0 });
    const rows = await t.ds.query(`SELECT s.code, d.code AS district, s.elevation FROM weather_stations s JOIN districts d ON d.id = s.district_id WHERE s.code LIKE 'ST-%' ORDER BY s.code`);
    expect(rows).toEqual([{ code: 'ST-A', district: 'ST-1', elevation: 12 }, { code: 'ST-B', district: 'ST-2', elevation: null }]);
    // Again with a new name: updated by code.
    const again = await admin.post('/api/weather/stations/import').attach('file', Buffer.from(csv(STATIONS, [['ST-A', 'Renamed', 10.5, 120.5, 12, '', '']])), 'stations.csv');
    expect(again.body).toMatchObject({ created: 0, updated: 1 });
    expect((await t.ds.query(`SELECT name FROM weather_stations WHERE code = 'ST-A'`))[0].name).toBe('Renamed');
  });

  it('when a station row is out of range, then the file is refused naming the line and nothing is written', async () => {
    const before = await countRows(t.ds, ...TABLES);
    const res = await admin.post('/api/weather/stations/import')
      .attach('file', Buffer.from(csv(STATIONS, [['OK-1', 'Fine', 1, 1, '', '', ''], ['BAD-1', 'Bad', 95, 1, '', '', '']])), 'stations.csv');
    expect(res.status).toBe(422);
    expect(res.body.report.problems).toEqual([expect.objectContaining({ index: 3, code: 'BAD-1', rule: 'row_invalid' })]);
    expect(res.body.report.problems[0].params).toEqual({ field: 'latitude' });
    expect(await countRows(t.ds, ...TABLES)).toEqual(before);
  });

  it('when a CSV header lacks a column, then the answer is 400 naming it', async () => {
    const res = await admin.post('/api/districts/populations/import').attach('file', Buffer.from('district,year\nX,2020\n'), 'p.csv');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('csv_header_invalid');
    expect(res.body.error.message).toMatch(/population/);
  });

  it('when populations are imported, then they are set by district code and year, an unknown district is a problem, and the dry run writes nothing', async () => {
    await importDistricts(squares('POP', 2, 130, 10, 'RP'));
    const file = csv('district,year,population', [['POP-1', 2023, 1000], ['pop-2', 2023, 2000], ['NOPE-1', 2023, 5]]);
    const before = await countRows(t.ds, ...TABLES);
    const dry = await admin.post('/api/districts/populations/import?dryRun=true').attach('file', Buffer.from(file), 'p.csv');
    expect(dry.body).toMatchObject({ created: 2, skipped: 1, problems: [expect.objectContaining({ index: 4, code: 'NOPE-1', rule: 'unknown_district' })] });
    expect(await countRows(t.ds, ...TABLES)).toEqual(before);
    const refused = await admin.post('/api/districts/populations/import').attach('file', Buffer.from(file), 'p.csv');
    expect(refused.status).toBe(422);
    expect(await countRows(t.ds, ...TABLES)).toEqual(before);
    const ok = await admin.post('/api/districts/populations/import?skipProblems=true').attach('file', Buffer.from(file), 'p.csv');
    expect(ok.body).toMatchObject({ created: 2, updated: 0 });
    const rows = await t.ds.query(`SELECT d.code, p.population FROM district_populations p JOIN districts d ON d.id = p.district_id WHERE p.year = 2023 AND d.code LIKE 'POP-%' ORDER BY d.code`);
    expect(rows).toEqual([{ code: 'POP-1', population: 1000 }, { code: 'POP-2', population: 2000 }]);
  });
});

describe('regions', () => {
  it('when an admin assigns profiles by region code, then every district of the region gets them', async () => {
    await importDistricts(squares('RG', 3, 140, 10, 'RG-A'));
    const res = await admin.put('/api/districts/profiles').send({ regionCodes: ['rg-a'], profiles: [{ profileId: 'culex-wnv', biofix: null }], reason: 'region set-up' });
    expect(res.status).toBe(200);
    expect(res.body.updated).toBe(3);
    const rows = await t.ds.query(`SELECT d.code FROM district_profiles p JOIN districts d ON d.id = p.district_id WHERE d.code LIKE 'RG-%' ORDER BY d.code`);
    expect(rows.map((r: { code: string }) => r.code)).toEqual(['RG-1', 'RG-2', 'RG-3']);
  });

  it('when a worker is scoped to a region, then their session holds every district of it', async () => {
    await importDistricts(squares('SC', 2, 150, 10, 'SC-R'));
    const [region] = await t.ds.query(`SELECT id FROM regions WHERE code = 'SC-R'`);
    const user = await makeUser(t.ds, { role: 'worker' });
    const invite = await admin.patch(`/api/users/${user.id}`).send({ regionIds: [region.id] });
    expect(invite.status).toBe(200);
    expect(invite.body.regions).toEqual([expect.objectContaining({ code: 'SC-R' })]);
    const worker = await signedInAgent(t.app, user.email);
    const list = await worker.get('/api/districts');
    expect(list.body.districts.map((d: { code: string }) => d.code).sort()).toEqual(['SC-1', 'SC-2']);
    const unknown = await admin.patch(`/api/users/${user.id}`).send({ regionIds: ['00000000-0000-4000-8000-000000000000'] });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error).toMatchObject({ code: 'unknown_region', fields: [expect.objectContaining({ path: 'regionIds' })] });
  });
});
