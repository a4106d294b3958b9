import { TIERS, type Tier } from '../../../shared/tier';

/**
 * Broodcast's tier scale: four steps of one deep plum, from pale (Baseline) to dark (Critical). A
 * sequential, single-hue scale keeps its order in grayscale and for colour-blind readers, and it is never
 * shown alone: every swatch, map area and legend entry also carries the tier word. Kept apart from the
 * indigo of the app's own chrome so a tier is never mistaken for a button or a link.
 */
export const TIER_COLOURS: Record<Tier, string> = {
  baseline: '#f3e9f1',
  raised: '#d2a6c8',
  high: '#94508a',
  critical: '#3f1239',
};

/** Text colour that reads on each tier's fill (contrast ≥ 4.5:1 for both). */
export const TIER_TEXT: Record<Tier, string> = {
  baseline: '#1d2026',
  raised: '#1d2026',
  high: '#ffffff',
  critical: '#ffffff',
};

/** The scale in tier order, for chart legends (visualMap pieces); the words come from `useLadderWords().tier`. */
export const TIER_SCALE = TIERS.map((tier, index) => ({ tier, index, colour: TIER_COLOURS[tier] }));

/** WCAG 2 relative luminance of an sRGB colour given as #rrggbb (0 = black, 1 = white). */
export function relativeLuminance(hex: string): number {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!m) throw new Error(`Not a #rrggbb colour: ${hex}`);
  const [r, g, b] = m.slice(1).map((h) => {
    const c = parseInt(h, 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  });
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** WCAG 2 contrast ratio of two #rrggbb colours (1–21). */
export function contrastRatio(a: string, b: string): number {
  const [hi, lo] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}
