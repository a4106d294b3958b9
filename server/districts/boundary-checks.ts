import { booleanValid, centroid, distance, kinks, point, rewind } from '@turf/turf';
import type { PolygonGeometry } from '../../shared/api/districts.schema';
import { HttpError } from '../http/errors';

/**
 * Checks on a district boundary before it is stored (issue 14, item 8), all with turf:
 * - validity: no self-intersection (`kinks`: a "bow-tie" ring) and the OGC simple-feature rules
 *   (`booleanValid`: holes inside their shell, rings not crossing each other) — refused with a code;
 * - orientation: rings rewound to the right-hand rule of RFC 7946 §3.1.6 (outer rings counter-
 *   clockwise, holes clockwise) with `rewind` — fixed, not refused;
 * - plausibility: a centroid far from the region's other districts, or one that lands among them
 *   once longitude and latitude are swapped — refused unless the admin confirms.
 */

/** A centroid counts as far when it is more than this from every other district's centroid, or more
 * than the region's own span when that is larger (common practice: a plausibility bound, not a rule). */
export const FAR_FLOOR_KM = 300;

export interface Reference {
  code: string;
  lon: number;
  lat: number;
}

export interface CheckedBoundary {
  geometry: PolygonGeometry;
  centre: [number, number];
  /** True when the rings had to be rewound to the right-hand rule. */
  orientationFixed: boolean;
}

const km = (a: [number, number], b: [number, number]) => distance(point(a), point(b), { units: 'kilometers' });
const round = (x: number, digits = 4) => Number(x.toFixed(digits));

/** Validity and orientation: throws a 400 with a code and parameters, or gives the rewound geometry. */
export function checkValidity(geometry: PolygonGeometry): CheckedBoundary {
  const crossings = kinks(geometry as never).features;
  if (crossings.length > 0) {
    const [lon, lat] = crossings[0].geometry.coordinates;
    throw new HttpError(400, 'boundary_self_intersecting',
      `The boundary crosses itself (${crossings.length} crossing point(s), the first near ${round(lon)}, ${round(lat)}).`,
      [{ path: 'coordinates', message: 'the boundary crosses itself' }],
      { points: crossings.length, lon: round(lon), lat: round(lat) });
  }
  if (!booleanValid(geometry as never))
    throw new HttpError(400, 'boundary_invalid',
      'The boundary is not a valid polygon (a hole outside its outer ring, or rings that cross each other).',
      [{ path: 'coordinates', message: 'is not a valid polygon' }]);
  const rewound = rewind(geometry as never, { reverse: false }) as unknown as PolygonGeometry;
  const orientationFixed = JSON.stringify(rewound.coordinates) !== JSON.stringify(geometry.coordinates);
  const centre = centroid(rewound as never).geometry.coordinates as [number, number];
  return { geometry: rewound, centre, orientationFixed };
}

/** The distance to the nearest reference, and which one. */
function nearest(c: [number, number], refs: Reference[]): { km: number; code: string } {
  let best = { km: Infinity, code: '' };
  for (const r of refs) {
    const d = km(c, [r.lon, r.lat]);
    if (d < best.km) best = { km: d, code: r.code };
  }
  return best;
}

/** How far a centroid may lie from the nearest reference: the floor, or the region's own span. */
export function farLimitKm(refs: Reference[]): number {
  let span = 0;
  for (let i = 0; i < refs.length; i++)
    for (let j = i + 1; j < refs.length; j++) span = Math.max(span, km([refs[i].lon, refs[i].lat], [refs[j].lon, refs[j].lat]));
  return Math.max(FAR_FLOOR_KM, span);
}

/**
 * Plausibility against the reference centroids (the region's other districts; the district's own
 * earlier centroid when it is the only one): throws a 409 the admin may override with `confirm`.
 */
export function checkPlausibility(centre: [number, number], refs: Reference[]): void {
  if (refs.length === 0) return; // nothing to compare with
  const limit = farLimitKm(refs);
  const here = nearest(centre, refs);
  if (here.km <= limit) return;
  const [lon, lat] = centre;
  const swapped: [number, number] = [lat, lon];
  if (Math.abs(lon) <= 90) {
    const there = nearest(swapped, refs);
    if (there.km <= limit)
      throw new HttpError(409, 'boundary_coordinates_swapped',
        `The boundary lies ${Math.round(here.km)} km from the nearest district (${here.code}); with longitude and latitude swapped it would lie ${Math.round(there.km)} km from ${there.code}. Check the coordinate order (GeoJSON is longitude, latitude), or confirm to save it as it is.`,
        undefined,
        { distanceKm: Math.round(here.km), swappedDistanceKm: Math.round(there.km), nearest: here.code, swappedNearest: there.code, confirmable: true });
  }
  throw new HttpError(409, 'boundary_far_from_region',
    `The boundary's centre lies ${Math.round(here.km)} km from the nearest district (${here.code}), more than ${Math.round(limit)} km. Confirm to save it anyway.`,
    undefined,
    { distanceKm: Math.round(here.km), limitKm: Math.round(limit), nearest: here.code, confirmable: true });
}
