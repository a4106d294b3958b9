import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runSeasonNow } from '../../server/season/season-run.service';
import { createTestApp, type TestApp } from '../support/test-app';
import { makeUser, signedInAgent } from '../support/factories';
import { csv, dayAfter } from '../support/weather-factories';

/**
 * A real country through the same endpoints as the screens (issue 17, "Done when").
 *
 * Boundaries: the npm package `us-atlas` 3.0.1 (ISC licence, by Mike Bostock), file `counties-10m.json`:
 * the US Census Bureau's cartographic boundary files of the counties (1:10,000,000, public domain as a
 * work of the US federal government) as a TopoJSON topology of 3,231 polygons, ids being the five-digit
 * FIPS county codes. Regions are the states: the first two digits of the county code, named from the
 * same package's `states` object. The file is real; we add only those two properties before the upload.
 *
 * Stations are placed at the coordinates of real cities; their weather is a smooth invented seasonal
 * curve (this test checks the plumbing from import to tier, not the climate), and populations are
 * invented round numbers.
 */
const require = createRequire(import.meta.url);
const ATLAS = require.resolve('us-atlas/counties-10m.json');
const AS_OF = '2026-08-20';

let t: TestApp;
let admin: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
});
afterAll(() => t.close());

/** The atlas with each county's state code and name as properties (the only change made to it). */
function countiesWithStates(): Buffer {
  const topo = JSON.parse(readFileSync(ATLAS, 'utf8'));
  const stateName = new Map<string, string>(topo.objects.states.geometries.map((g: { id: string; properties: { name: string } }) => [g.id, g.properties.name]));
  for (const g of topo.objects.counties.geometries) {
    g.properties = { ...g.properties, state: String(g.id).slice(0, 2), stateName: stateName.get(String(g.id).slice(0, 2)) ?? '' };
  }
  return Buffer.from(JSON.stringify(topo));
}

const FIELDS = { codeProperty: 'id', nameProperty: 'name', parentCodeProperty: 'state', parentNameProperty: 'stateName', objectName: 'counties' };
const importCounties = (query: string) => {
  let req = admin.post(`/api/districts/import${query}`);
  for (const [k, v] of Object.entries(FIELDS)) req = req.field(k, v);
  return req.attach('file', countiesWithStates(), 'counties-10m.topojson');
};

/** Stations at real city coordinates in Florida (12) and Louisiana (22). */
const STATIONS: [string, string, number, number, number][] = [
  ['US-MIA', 'Miami', 25.7617, -80.1918, 2],
  ['US-TPA', 'Tampa', 27.9506, -82.4572, 15],
  ['US-ORL', 'Orlando', 28.5383, -81.3792, 25],
  ['US-JAX', 'Jacksonville', 30.3322, -81.6557, 5],
  ['US-MSY', 'New Orleans', 29.9511, -90.0715, 1],
  ['US-BTR', 'Baton Rouge', 30.4515, -91.1871, 17],
];

describe('a real country, from an empty installation to tiers', () => {
  it('when the US counties, stations, populations and weather go in through the imports, then districts with weather get tiers from the model', async () => {
    const timings: Record<string, number> = {};
    const time = async <T>(name: string, f: () => Promise<T>) => {
      const s = performance.now();
      const out = await f();
      timings[name] = Math.round(performance.now() - s);
      return out;
    };

    // 1. The boundary file: dry run (writes nothing), then the import skipping the polygons the checks refuse.
    const dry = await time('districts dry run', () => importCounties('?dryRun=true'));
    expect(dry.status).toBe(200);
    expect(dry.body.total).toBe(3231);
    expect(Number((await t.ds.query('SELECT count(*) FROM districts'))[0].count)).toBe(0);
    // The 10m file is simplified and quantized: some counties' rings cross themselves there. They are listed, by index and code.
    expect(dry.body.problems.length).toBeGreaterThan(0);
    expect(dry.body.problems.length).toBeLessThan(200);
    for (const p of dry.body.problems) expect(['boundary_self_intersecting', 'boundary_invalid', 'boundary_coordinates_swapped']).toContain(p.rule);
    const real = await time('districts import', () => importCounties('?skipProblems=true'));
    expect(real.status).toBe(200);
    expect(real.body.created).toBe(dry.body.created);
    expect(real.body.regions.created).toBeGreaterThanOrEqual(50);
    const regions = (await admin.get('/api/regions')).body.regions;
    expect(regions.find((r: { code: string }) => r.code === '12')).toMatchObject({ name: 'Florida' });

    // 2. Stations and populations as CSV.
    const stations = await time('stations import', () => admin.post('/api/weather/stations/import')
      .attach('file', Buffer.from(csv('code,name,latitude,longitude,elevation,activeFrom,activeTo', STATIONS.map((s) => [...s, '2020-01-01', '']))), 'stations.csv'));
    expect(stations.body).toMatchObject({ created: 6, problems: [] });
    const placed = await t.ds.query(`SELECT s.code, d.name FROM weather_stations s JOIN districts d ON d.id = s.district_id ORDER BY s.code`);
    expect(placed.find((p: { code: string }) => p.code === 'US-MIA').name).toBe('Miami-Dade');
    const codes: { code: string }[] = await t.ds.query(`SELECT code FROM districts ORDER BY code`);
    const pops = await time('populations import', () => admin.post('/api/districts/populations/import')
      .attach('file', Buffer.from(csv('district,year,population', codes.map((c, i) => [c.code, 2026, 10_000 + i]))), 'populations.csv'));
    expect(pops.body).toMatchObject({ created: codes.length, problems: [] });

    // 3. Profiles by region: Florida and Louisiana.
    const assigned = await admin.put('/api/districts/profiles').send({ regionCodes: ['12', '22'], profiles: [{ profileId: 'aedes-aegypti-dengue', biofix: null }], reason: 'Gulf coast set-up' });
    expect(assigned.status).toBe(200);
    expect(assigned.body.updated).toBeGreaterThan(100);

    // 4. Weather for the six stations (invented smooth season), uploaded like the Intake screen does.
    const rows = STATIONS.flatMap(([code]) => Array.from({ length: 243 }, (_, i) => {
      const warm = 6 * Math.sin((2 * Math.PI * (i - 20)) / 365);
      return [code, dayAfter('2026-01-01', i), (20 + warm).toFixed(1), (30 + warm).toFixed(1), 75, i % 3];
    }));
    const up = await time('weather upload', () => admin.post('/api/weather/uploads?wait=true').field('tempUnit', 'C').field('rainUnit', 'mm')
      .attach('file', Buffer.from(csv('station,date,tmin,tmax,rh,rain', rows)), 'weather.csv'));
    expect(up.status).toBeLessThan(300);

    // 5. The season run: tiers from the model for districts with weather and a profile.
    await time('season run', () => runSeasonNow(t.ctx, { asOf: AS_OF }));
    const [miami] = await t.ds.query(`SELECT t.tier, t.confidence FROM district_tiers t JOIN districts d ON d.id = t.district_id WHERE d.code = '12086'`);
    expect(miami).toBeTruthy();
    expect(miami.confidence).not.toBe('insufficient');
    const modelled = await t.ds.query(`SELECT count(*)::int AS n FROM district_tiers t JOIN districts d ON d.id = t.district_id
      JOIN regions r ON r.id = d.region_id WHERE r.code IN ('12', '22') AND t.confidence <> 'insufficient'`);
    expect(modelled[0].n).toBeGreaterThan(100);
    console.info('real country timings (ms):', JSON.stringify(timings), 'districts:', real.body.created, 'problems:', dry.body.problems.length);
  }, 180_000);
});
