import { bbox, booleanPointInPolygon, distance, point } from '@turf/turf';
import { around } from 'geokdbush';
import KDBush from 'kdbush';
import type { EntityManager } from 'typeorm';
import type { PolygonGeometry } from '../../shared/api/districts.schema';
import { idwWeights } from '../../shared/weather/qc';

interface StationPos { id: string; latitude: number; longitude: number; elevation: number | null }
interface DistrictGeo { id: string; boundary: PolygonGeometry | null; centroid_lat: number | null; centroid_lon: number | null }

const km = (a: [number, number], b: [number, number]) => distance(point(a), point(b), { units: 'kilometers' });

/**
 * Assign every station to the district whose boundary contains it (turf's point-in-polygon), and write
 * each district's weather sources: its own stations with equal weights, or — for a district with none —
 * the `idwCount` nearest stations to its centroid with inverse-distance weights. Returns the districts
 * whose sources changed (their series must be recomputed).
 *
 * `placeStations: false` keeps each station in the district it is stored in and only rewrites the sources
 * (so a changed WEATHER_IDW_* setting still takes effect): for a weather intake, which moves no station and
 * no boundary — every writer of stations and districts places them in its own transaction — and so need not
 * read and test every boundary (issue 17: at 5,000 districts that was most of an unchanged re-upload).
 */
export async function refreshAssignments(
  manager: EntityManager, idwCount: number, maxKm = Number.POSITIVE_INFINITY, opts: { placeStations?: boolean } = {},
): Promise<Set<string>> {
  const placeStations = opts.placeStations ?? true;
  const stations: (StationPos & { district_id: string | null })[] = await manager.query('SELECT id, latitude, longitude, elevation, district_id FROM weather_stations');
  const districts: DistrictGeo[] = await manager.query(
    `SELECT id, ${placeStations ? 'boundary' : 'NULL AS boundary'}, centroid_lat, centroid_lon FROM districts`,
  );
  const inside = new Map<string, string[]>();
  const assignment = new Map<string, string | null>();
  const withBoxes = districts.filter((d) => d.boundary).map((d) => ({ d, box: bbox(d.boundary as never) }));
  for (const s of stations) {
    if (!placeStations) {
      assignment.set(s.id, s.district_id);
      if (s.district_id) inside.set(s.district_id, [...(inside.get(s.district_id) ?? []), s.id]);
      continue;
    }
    const p = point([s.longitude, s.latitude]);
    let found: string | null = null;
    for (const { d, box } of withBoxes) {
      if (s.longitude < box[0] || s.longitude > box[2] || s.latitude < box[1] || s.latitude > box[3]) continue;
      if (booleanPointInPolygon(p, d.boundary as never)) {
        found = d.id;
        break;
      }
    }
    assignment.set(s.id, found);
    if (found) inside.set(found, [...(inside.get(found) ?? []), s.id]);
  }
  // Station → district, only where it changed.
  const changed = stations.filter((c) => (assignment.get(c.id) ?? null) !== c.district_id);
  if (changed.length)
    await manager.query(
      `UPDATE weather_stations s SET district_id = v.did FROM unnest($1::uuid[], $2::uuid[]) AS v(sid, did) WHERE s.id = v.sid`,
      [changed.map((c) => c.id), changed.map((c) => assignment.get(c.id) ?? null)],
    );

  const byId = new Map(stations.map((s) => [s.id, s]));
  // Nearest stations by a k-d tree (issue 17: all pairs cost districts × stations turf distances). geokdbush
  // ranks by its own great-circle distance, so it proposes a few more candidates than needed, a hair beyond
  // maxKm; turf's distance then filters, orders and weights them exactly as before.
  const index = new KDBush(stations.length);
  for (const s of stations) index.add(s.longitude, s.latitude);
  index.finish();
  const candidates = idwCount + 4;
  const rows: { districtId: string; stationId: string; method: string; distanceKm: number; weight: number }[] = [];
  for (const d of districts) {
    if (d.centroid_lat === null || d.centroid_lon === null) continue;
    const centre: [number, number] = [d.centroid_lon, d.centroid_lat];
    const own = inside.get(d.id);
    if (own?.length) {
      for (const sid of own) {
        const s = byId.get(sid)!;
        rows.push({ districtId: d.id, stationId: sid, method: 'inside', distanceKm: km(centre, [s.longitude, s.latitude]), weight: 1 / own.length });
      }
    } else if (stations.length) {
      const nearest = around(index, centre[0], centre[1], candidates, maxKm * 1.001 + 1)
        .map((j) => stations[j])
        .map((s) => ({ s, d: km(centre, [s.longitude, s.latitude]) }))
        // Only stations within WEATHER_IDW_MAX_KM feed a district: a district with none that near gets no
        // interpolated series ("not enough data") rather than another climate's weather.
        .filter((n) => n.d <= maxKm)
        .sort((a, b) => a.d - b.d)
        .slice(0, idwCount);
      const weights = idwWeights(nearest.map((n) => n.d));
      nearest.forEach((n, i) => rows.push({ districtId: d.id, stationId: n.s.id, method: 'interpolated', distanceKm: n.d, weight: weights[i] }));
    }
  }
  const before: { district_id: string; station_id: string; method: string; weight: number }[] = await manager.query(
    'SELECT district_id, station_id, method, weight FROM district_weather_sources',
  );
  const sig = (r: { d: string; s: string; m: string; w: number }) => `${r.s}:${r.m}:${r.w.toFixed(6)}`;
  const sigOf = (list: { d: string; s: string; m: string; w: number }[]) => {
    const out = new Map<string, string>();
    for (const r of [...list].sort((a, b) => a.s.localeCompare(b.s))) out.set(r.d, (out.get(r.d) ?? '') + sig(r) + ';');
    return out;
  };
  const oldSig = sigOf(before.map((r) => ({ d: r.district_id, s: r.station_id, m: r.method, w: r.weight })));
  const newSig = sigOf(rows.map((r) => ({ d: r.districtId, s: r.stationId, m: r.method, w: r.weight })));
  const touched = new Set<string>();
  for (const d of new Set([...oldSig.keys(), ...newSig.keys()])) if (oldSig.get(d) !== newSig.get(d)) touched.add(d);
  if (touched.size) {
    await manager.query('DELETE FROM district_weather_sources WHERE district_id = ANY($1::uuid[])', [[...touched]]);
    const put = rows.filter((r) => touched.has(r.districtId));
    if (put.length)
      await manager.query(
        `INSERT INTO district_weather_sources (district_id, station_id, method, distance_km, weight)
         SELECT * FROM unnest($1::uuid[], $2::uuid[], $3::text[], $4::float8[], $5::float8[])`,
        [put.map((r) => r.districtId), put.map((r) => r.stationId), put.map((r) => r.method), put.map((r) => r.distanceKm), put.map((r) => r.weight)],
      );
  }
  return touched;
}

export interface Neighbour { stationId: string; neighbourId: string; weight: number; /** °C to add to the neighbour's value. */ lapse: number }

/** Standard environmental lapse rate, °C per metre (ICAO standard atmosphere, 6.5 °C/km). */
export const LAPSE_C_PER_M = 0.0065;

/**
 * For the spatial check: each station's up to four nearest other stations within `maxKm`, with
 * inverse-distance weights and the lapse-rate correction that brings a neighbour's temperature to the
 * station's elevation. A k-d tree of the stations (kdbush, searched by great-circle distance with
 * geokdbush) finds them; turf measures the distances the weights use.
 */
export function neighbours(stations: StationPos[], maxKm: number, count = 4): Neighbour[] {
  const out: Neighbour[] = [];
  if (!stations.length) return out;
  const index = new KDBush(stations.length);
  for (const s of stations) index.add(s.longitude, s.latitude);
  index.finish();
  stations.forEach((s, i) => {
    const nearest = around(index, s.longitude, s.latitude, count, maxKm, (j) => j !== i)
      .map((j) => ({ n: stations[j], d: km([s.longitude, s.latitude], [stations[j].longitude, stations[j].latitude]) }));
    const weights = idwWeights(nearest.map((x) => Math.max(x.d, 0.1)));
    nearest.forEach((x, k) =>
      out.push({
        stationId: s.id, neighbourId: x.n.id, weight: weights[k],
        lapse: s.elevation !== null && x.n.elevation !== null ? LAPSE_C_PER_M * (x.n.elevation - s.elevation) : 0,
      }),
    );
  });
  return out;
}
