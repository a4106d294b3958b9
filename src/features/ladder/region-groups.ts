import type { LadderRow } from '../../../shared/api/board.schema';
import { TIERS, type Tier } from '../../../shared/tier';

/** The region filter's value: every district, the signed-in person's regions, districts in no region, or one region's id. */
export type RegionChoice = 'all' | 'mine' | 'none' | string;

/** One region's roll-up on the Ladder: districts per tier and the largest changes since last week. */
export interface RegionGroup {
  /** The region's id; null for districts in no region. */
  id: string | null;
  code: string | null;
  name: string | null;
  districts: number;
  perTier: Record<Tier, number>;
  /** Districts without a tier this week ("not enough data"); not counted in `perTier`. */
  noTier: number;
  /** Districts whose tier went up / down since last week. */
  up: number;
  down: number;
  /** Up to three districts with the largest tier change (then score change) since last week, largest first. */
  largestChanges: LadderRow[];
}

/** The rows the region choice keeps (`mine` keeps the regions in `myRegionIds`). */
export function rowsOfRegion(rows: readonly LadderRow[], choice: RegionChoice, myRegionIds: readonly string[] = []): LadderRow[] {
  if (choice === 'all') return [...rows];
  if (choice === 'none') return rows.filter((r) => r.region === null);
  if (choice === 'mine') {
    const mine = new Set(myRegionIds);
    return rows.filter((r) => r.region !== null && mine.has(r.region.id));
  }
  return rows.filter((r) => r.region?.id === choice);
}

/** Size of a change for ranking: tier steps first, then the score's move (both in absolute value). */
const changeSize = (r: LadderRow) => Math.abs(r.tierChange ?? 0) * 10 + Math.abs(r.scoreChange ?? 0);

/** Groups rows by region (named regions by name, then districts in no region), keeping each group's row order. */
export function groupByRegion(rows: readonly LadderRow[], language?: string): RegionGroup[] {
  const groups = new Map<string, { id: string | null; code: string | null; name: string | null; rows: LadderRow[] }>();
  for (const r of rows) {
    const key = r.region?.id ?? '';
    let g = groups.get(key);
    if (!g) groups.set(key, (g = { id: r.region?.id ?? null, code: r.region?.code ?? null, name: r.region?.name ?? null, rows: [] }));
    g.rows.push(r);
  }
  return [...groups.values()]
    .sort((a, b) => (a.id === null ? 1 : 0) - (b.id === null ? 1 : 0) || (a.name ?? '').localeCompare(b.name ?? '', language))
    .map((g) => {
      const perTier = Object.fromEntries(TIERS.map((t) => [t, 0])) as Record<Tier, number>;
      for (const r of g.rows) if (r.confidence !== 'insufficient') perTier[r.tier] += 1;
      const largestChanges = g.rows
        .filter((r) => changeSize(r) > 0)
        .sort((a, b) => changeSize(b) - changeSize(a) || a.rank - b.rank)
        .slice(0, 3);
      return {
        id: g.id,
        code: g.code,
        name: g.name,
        districts: g.rows.length,
        perTier,
        noTier: g.rows.filter((r) => r.confidence === 'insufficient').length,
        up: g.rows.filter((r) => (r.tierChange ?? 0) > 0).length,
        down: g.rows.filter((r) => (r.tierChange ?? 0) < 0).length,
        largestChanges,
      };
    });
}

/** The rows in region order (as `groupByRegion`), each region's rows keeping their rank order. */
export function rowsInRegionOrder(rows: readonly LadderRow[], language?: string): LadderRow[] {
  const order = new Map(groupByRegion(rows, language).map((g, i) => [g.id ?? '', i]));
  return [...rows].sort((a, b) => order.get(a.region?.id ?? '')! - order.get(b.region?.id ?? '')! || a.rank - b.rank);
}
