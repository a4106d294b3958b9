/**
 * The invented Halvern Region (docs/product.md § The demo region): twelve districts between 24° and 34° north, generated
 * reproducibly from a seed. Every name, boundary and population here is made up; nothing is real.
 *
 * Four bands from south to north — warm humid coast (Aedes with dengue), a river valley (Anopheles
 * with vivax malaria), a temperate plateau (Culex with West Nile virus, with diapause) and cool
 * highlands — three districts each. Boundaries tile a jittered grid, so neighbours share edges.
 */
import type { PolygonGeometry } from '../shared/api/districts.schema';
import { seededRandom } from './random';

export const DEMO_SEED = 20_261_201;
export const DEMO_REGION_NAME = 'Halvern Region';

export type DemoZone = 'coast' | 'valley' | 'plateau' | 'highlands';

export interface DemoDistrict {
  code: string;
  name: string;
  zone: DemoZone;
  /** Profiles of the vector–pathogen pairs that matter there (ids of the season model). */
  profiles: string[];
  boundary: PolygonGeometry;
  populations: { year: number; population: number }[];
}

const ZONES: { zone: DemoZone; profiles: string[]; names: string[]; basePopulation: number }[] = [
  { zone: 'coast', profiles: ['aedes-aegypti-dengue', 'aedes-albopictus-dengue'], names: ['Saltmere', 'Korrin Bay', 'Vessmouth'], basePopulation: 240_000 },
  { zone: 'valley', profiles: ['anopheles-vivax', 'anopheles-falciparum'], names: ['Tamber Vale', 'Orrin Ford', 'Lowmill'], basePopulation: 160_000 },
  { zone: 'plateau', profiles: ['culex-wnv'], names: ['Hestfield', 'Dunmarrow', 'Brackenmoor'], basePopulation: 90_000 },
  { zone: 'highlands', profiles: ['culex-wnv'], names: ['Fellhigh', 'Ravel Crest', 'Caddon Heights'], basePopulation: 35_000 },
];

const LAT_MIN = 24;
const LAT_STEP = 2.5; // four bands: 24–26.5–29–31.5–34 °N
const LON_MIN = 51;
const LON_STEP = 1.6;
const COLS = 3;

export const DEMO_YEARS = [2020, 2021, 2022, 2023, 2024, 2025, 2026];

const round = (x: number, digits = 4) => Math.round(x * 10 ** digits) / 10 ** digits;

export function buildDemoRegion(seed = DEMO_SEED): DemoDistrict[] {
  const random = seededRandom(seed);
  // Grid corners (rows 0..4, cols 0..3), jittered inside the region only; the outer edge stays straight.
  const corners: [number, number][][] = [];
  for (let r = 0; r <= ZONES.length; r++) {
    corners.push([]);
    for (let c = 0; c <= COLS; c++) {
      const inner = r > 0 && r < ZONES.length && c > 0 && c < COLS;
      const jitterLon = inner ? (random() - 0.5) * LON_STEP * 0.4 : 0;
      const jitterLat = inner ? (random() - 0.5) * LAT_STEP * 0.3 : 0;
      corners[r].push([round(LON_MIN + c * LON_STEP + jitterLon), round(LAT_MIN + r * LAT_STEP + jitterLat)]);
    }
  }
  const districts: DemoDistrict[] = [];
  ZONES.forEach((zone, r) => {
    zone.names.forEach((name, c) => {
      const ring: [number, number][] = [corners[r][c], corners[r][c + 1], corners[r + 1][c + 1], corners[r + 1][c], corners[r][c]];
      const base = zone.basePopulation * (0.7 + random() * 0.6);
      const growth = 0.008 + random() * 0.02;
      districts.push({
        code: `HV-${String(districts.length + 1).padStart(2, '0')}`,
        name,
        zone: zone.zone,
        profiles: zone.profiles,
        boundary: { type: 'Polygon', coordinates: [ring] },
        populations: DEMO_YEARS.map((year, i) => ({ year, population: Math.round(base * (1 + growth) ** i) })),
      });
    });
  });
  return districts;
}

/** One demo user per role; the epidemiologist covers the coast and the valley, the worker one coastal district. */
export const DEMO_PASSWORD = 'broodcast-demo';
export const DEMO_USERS = [
  { email: 'admin@halvern.example', displayName: 'Ada Marren', role: 'admin', districtCodes: [] },
  { email: 'officer@halvern.example', displayName: 'Tobin Ashgrove', role: 'officer', districtCodes: [] },
  { email: 'epi@halvern.example', displayName: 'Nela Quist', role: 'epidemiologist', districtCodes: ['HV-01', 'HV-02', 'HV-03', 'HV-04', 'HV-05', 'HV-06'] },
  { email: 'supervisor@halvern.example', displayName: 'Ravi Dunstall', role: 'supervisor', districtCodes: [] },
  { email: 'worker@halvern.example', displayName: 'Mira Holloway', role: 'worker', districtCodes: ['HV-01'] },
] as const;
