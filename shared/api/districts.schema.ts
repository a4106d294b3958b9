import { z } from 'zod';
import { uuid } from './common.schema';

const position = z
  .array(z.number({ message: 'coordinates must be numbers' }).finite())
  .min(2, { message: 'a position needs longitude and latitude' })
  .max(3)
  .refine(([lon, lat]) => lon >= -180 && lon <= 180 && lat >= -90 && lat <= 90, {
    message: 'longitude must be within ±180 and latitude within ±90',
  });
const ring = z
  .array(position)
  .min(4, { message: 'a linear ring needs at least four positions' })
  .refine((r) => r[0][0] === r[r.length - 1][0] && r[0][1] === r[r.length - 1][1], {
    message: 'a linear ring must end where it starts',
  });

/** A district boundary: a GeoJSON (RFC 7946) Polygon or MultiPolygon, bare or inside a Feature. */
export const polygonGeometry = z.discriminatedUnion(
  'type',
  [
    z.object({ type: z.literal('Polygon'), coordinates: z.array(ring).min(1) }),
    z.object({ type: z.literal('MultiPolygon'), coordinates: z.array(z.array(ring).min(1)).min(1) }),
  ],
  { message: 'type must be Polygon or MultiPolygon' },
);
export type PolygonGeometry = z.infer<typeof polygonGeometry>;

export const boundaryBody = z.union(
  [
    polygonGeometry,
    z.object({ type: z.literal('Feature'), geometry: polygonGeometry, properties: z.any().optional() }),
  ],
  { message: 'must be a GeoJSON Polygon, MultiPolygon or a Feature holding one' },
);

/** `PUT /api/districts/:id/boundary?confirm=true`: save a boundary the plausibility check questioned. */
export const boundaryQuery = z.strictObject({
  confirm: z.enum(['true', 'false'], { message: 'must be true or false' }).optional(),
});

export const DISTRICT_CODE_PATTERN = /^[A-Z0-9-]{2,16}$/;
const code = z
  .string()
  .trim()
  .regex(DISTRICT_CODE_PATTERN, { message: 'must be 2–16 capital letters, digits or hyphens' });
const name = z.string().trim().min(1, { message: 'is required' }).max(120, { message: 'is too long' });

export const districtCreateBody = z.strictObject({ code, name });
export const districtUpdateBody = z
  .strictObject({ code: code.optional(), name: name.optional() })
  .refine((b) => Object.keys(b).length > 0, { message: 'nothing to change' });
export const populationBody = z.strictObject({
  year: z.number().int({ message: 'must be a whole year' }).min(1900).max(2100),
  population: z.number().int({ message: 'must be a whole number' }).min(0).max(2_000_000_000),
});
export type PopulationBody = z.infer<typeof populationBody>;

export const districtDto = z.object({
  id: uuid,
  code: z.string(),
  name: z.string(),
  isDemo: z.boolean(),
  /** The district's region (GET /api/regions), or null. */
  regionId: uuid.nullable().default(null),
  populations: z.array(z.object({ year: z.number(), population: z.number() })),
  /** The vector–pathogen profiles assigned to the district (its own diseases are those with one of them). */
  profileIds: z.array(z.string()).default([]),
  hasBoundary: z.boolean(),
  centroid: z.object({ lat: z.number(), lon: z.number() }).nullable(),
});
export type DistrictDto = z.infer<typeof districtDto>;
export const districtsResponse = z.object({ districts: z.array(districtDto) });

/** `GET /api/districts/boundaries`: the districts the user may see, as one GeoJSON FeatureCollection. */
export const boundariesResponse = z.object({
  type: z.literal('FeatureCollection'),
  features: z.array(
    z.object({
      type: z.literal('Feature'),
      id: uuid,
      properties: z.object({ id: uuid, code: z.string(), name: z.string() }),
      geometry: polygonGeometry,
    }),
  ),
});
export type BoundariesResponse = z.infer<typeof boundariesResponse>;
