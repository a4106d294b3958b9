/**
 * Invented weather stations of the Halvern Region (docs/product.md § The demo region), placed reproducibly inside their
 * districts. A station's code carries its district's number (HVS-05 stands in HV-05; Saltmere's second
 * station is HVS-01B) and its name fits its ground: harbours and quays on the coast, mills and bridges
 * in the valleys, ridges on the plateau, passes in the highlands, at the zone's elevations. Lowmill
 * (HV-06) and Ravel Crest (HV-11) have none, so their District files show the distance-weighted
 * fallback; Saltmere (HV-01) has two. Nothing here is real.
 */
import { booleanPointInPolygon, point, pointOnFeature } from '@turf/turf';
import { buildDemoRegion, DEMO_SEED, type DemoZone } from './demo-region';
import { seededRandom } from './random';

export interface DemoStation {
  code: string;
  name: string;
  zone: DemoZone;
  latitude: number;
  longitude: number;
  elevation: number;
  activeFrom: string;
  /** Index used to seed the station's own noise. */
  index: number;
}

const WITHOUT_STATION = new Set(['HV-06', 'HV-11']);
const ELEVATION: Record<DemoZone, [number, number]> = { coast: [5, 60], valley: [120, 320], plateau: [780, 1050], highlands: [1750, 2300] };
/** Station name endings that fit each zone's ground (a "Harbour" at 1,000 m would not). */
export const STATION_SUFFIXES: Record<DemoZone, readonly string[]> = {
  coast: ['Harbour', 'Quay', 'Point'],
  valley: ['Mill', 'Bridge', 'Meadow'],
  plateau: ['Ridge', 'Cross', 'Downs'],
  highlands: ['Pass', 'Summit', 'Tarn'],
};

export function buildDemoStations(seed = DEMO_SEED): DemoStation[] {
  const random = seededRandom(seed + 17);
  const out: DemoStation[] = [];
  const inZone = new Map<DemoZone, number>();
  for (const d of buildDemoRegion(seed)) {
    const nth = inZone.get(d.zone) ?? 0;
    inZone.set(d.zone, nth + 1);
    if (WITHOUT_STATION.has(d.code)) continue;
    const copies = d.code === 'HV-01' ? 2 : 1;
    const [lon, lat] = pointOnFeature(d.boundary as never).geometry.coordinates;
    const suffixes = STATION_SUFFIXES[d.zone];
    for (let k = 0; k < copies; k++) {
      const [lo, hi] = ELEVATION[d.zone];
      // A small seeded offset keeps two stations of one district apart; pointOnFeature is inside the
      // boundary, and an offset that would leave the district is halved until the station is back inside.
      let dLat = (k === 0 ? 0 : 0.12) + (random() - 0.5) * 0.02;
      let dLon = (k === 0 ? 0 : 0.15) + (random() - 0.5) * 0.02;
      for (let tries = 0; tries < 8 && !booleanPointInPolygon(point([lon + dLon, lat + dLat]), d.boundary as never); tries++) {
        dLat /= 2;
        dLon /= 2;
      }
      const number = d.code.slice(3); // "HV-05" → "05"
      out.push({
        code: `HVS-${number}${k === 0 ? '' : String.fromCharCode(65 + k)}`,
        name: `${d.name} ${suffixes[(nth + k) % suffixes.length]}`,
        zone: d.zone,
        latitude: Math.round((lat + dLat) * 10000) / 10000,
        longitude: Math.round((lon + dLon) * 10000) / 10000,
        elevation: Math.round(lo + random() * (hi - lo)),
        activeFrom: '2020-01-01',
        index: out.length,
      });
    }
  }
  return out;
}
