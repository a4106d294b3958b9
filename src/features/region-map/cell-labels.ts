import type { BoundariesResponse } from './api/boundaries.api';

type Feature = BoundariesResponse['features'][number];

/** ECharts draws a GeoJSON map with its height stretched by 1 / this (its `aspectScale` default for lon/lat). */
const ASPECT_SCALE = 0.75;
/** Part of a district's bounding box its label may use (an irregular shape is narrower than its box). */
const USABLE = 0.7;
/** Lato's average glyph is about this share of the font size wide (derived: measured on "HV-05 Critique"). */
const GLYPH = 0.6;
const LINE = 1.25;

export type CellLabel = { show: false } | { show: true; fontSize: number; lines: 'codeAndTier' | 'code' };

/** Bounding box [minX, minY, maxX, maxY] of a district's polygons. */
export function featureBox(f: Feature): [number, number, number, number] {
  const polygons = f.geometry.type === 'Polygon' ? [f.geometry.coordinates] : f.geometry.coordinates;
  let box: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const polygon of polygons)
    for (const [x, y] of polygon[0] ?? []) box = [Math.min(box[0], x!), Math.min(box[1], y!), Math.max(box[2], x!), Math.max(box[3], y!)];
  return box;
}

/**
 * Each district's cell size on screen, in CSS px, for a map drawn into `width × height` px the way ECharts
 * fits a GeoJSON map (whole extent centred, aspect kept with `aspectScale` 0.75).
 */
export function cellSizes(features: readonly Feature[], width: number, height: number): Map<string, { w: number; h: number }> {
  const boxes = features.map((f) => [f.id, featureBox(f)] as const);
  const all = boxes.reduce<[number, number, number, number]>(
    (a, [, b]) => [Math.min(a[0], b[0]), Math.min(a[1], b[1]), Math.max(a[2], b[2]), Math.max(a[3], b[3])],
    [Infinity, Infinity, -Infinity, -Infinity],
  );
  const spanX = Math.max(all[2] - all[0], 1e-9) * ASPECT_SCALE;
  const spanY = Math.max(all[3] - all[1], 1e-9);
  const scale = Math.min(width / spanX, height / spanY);
  return new Map(boxes.map(([id, b]) => [id, { w: (b[2] - b[0]) * ASPECT_SCALE * scale, h: (b[3] - b[1]) * scale }]));
}

/**
 * What a district's label can hold in its cell: its code and tier word, else its code alone, at 10 px and
 * then 8 px; nothing when not even the code fits (the tooltip, the legend and the Ladder still name it).
 * ECharts' own `labelLayout.hideOverlap` only hides labels that overlap each other, not one that spills out
 * of its own district, so the sizes are worked out here.
 */
export function cellLabel(cell: { w: number; h: number }, code: string, tierWord: string): CellLabel {
  const w = cell.w * USABLE;
  const h = cell.h * USABLE;
  for (const fontSize of [10, 8]) {
    const line = fontSize * LINE;
    const codeW = code.length * fontSize * GLYPH;
    const tierW = tierWord.length * fontSize * GLYPH;
    if (Math.max(codeW, tierW) <= w && 2 * line <= h) return { show: true, fontSize, lines: 'codeAndTier' };
    if (codeW <= w && line <= h) return { show: true, fontSize, lines: 'code' };
  }
  return { show: false };
}
