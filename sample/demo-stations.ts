/**
 * Invented weather stations of the Halvern Region (DESIGN.md §6), placed reproducibly inside their
 * districts. Lowmill (HV-06) and Ravel Crest (HV-11) have none, so their District files show the
 * distance-weighted fallback; Saltmere (HV-01) has two. Nothing here is real.
 */
import { pointOnFeature } from '@turf/turf';
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
const SUFFIX = ['Harbour', 'Ford', 'Mill', 'Ridge', 'Field', 'Cross'];

export function buildDemoStations(seed = DEMO_SEED): DemoStation[] {
  const random = seededRandom(seed + 17);
  const out: DemoStation[] = [];
  for (const d of buildDemoRegion(seed)) {
    if (WITHOUT_STATION.has(d.code)) continue;
    const copies = d.code === 'HV-01' ? 2 : 1;
    const [lon, lat] = pointOnFeature(d.boundary as never).geometry.coordinates;
    for (let k = 0; k < copies; k++) {
      const [lo, hi] = ELEVATION[d.zone];
      out.push({
        code: `HVS-${String(out.length + 1).padStart(2, '0')}`,
        name: `${d.name} ${SUFFIX[(out.length + k) % SUFFIX.length]}`,
        zone: d.zone,
        // A small seeded offset keeps two stations of one district apart; pointOnFeature is inside the boundary.
        latitude: Math.round((lat + (k === 0 ? 0 : 0.12) + (random() - 0.5) * 0.02) * 10000) / 10000,
        longitude: Math.round((lon + (k === 0 ? 0 : 0.15) + (random() - 0.5) * 0.02) * 10000) / 10000,
        elevation: Math.round(lo + random() * (hi - lo)),
        activeFrom: '2020-01-01',
        index: out.length,
      });
    }
  }
  return out;
}
