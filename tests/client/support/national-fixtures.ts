import { ladderRow } from './board-fixtures';

/**
 * A generated country of ~3,000 districts in 50 regions (issue 17, national scale): invented names and
 * codes, the first 12 of them demo districts. Only sizes matter here; real boundaries are in the browser test.
 */
const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
export const NATIONAL_COUNT = 3000;
export const regionOf = (n: number) => ({ id: id(900_000 + (n % 50)), code: `R${String(n % 50).padStart(2, '0')}`, name: `Region ${String(n % 50).padStart(2, '0')}` });
export const nationalRegions = Array.from({ length: 50 }, (_, k) => ({ ...regionOf(k), districtCount: NATIONAL_COUNT / 50 }));
const code = (n: number) => (n <= 12 ? `HV-${String(n).padStart(2, '0')}` : `C${String(n).padStart(5, '0')}`);
const name = (n: number) => (n <= 12 ? `Demo District ${n}` : `County ${n}`);
const TIERS = ['critical', 'high', 'raised', 'baseline'] as const;

export const nationalDistricts = Array.from({ length: NATIONAL_COUNT }, (_, k) => {
  const n = k + 1;
  return { id: id(n), code: code(n), name: name(n), isDemo: n <= 12, populations: [], hasBoundary: true, centroid: null, regionId: regionOf(n).id, region: regionOf(n) };
});

export const nationalBoardRows = nationalDistricts.map((d, k) =>
  ladderRow(k + 1, {
    districtId: d.id,
    code: d.code,
    name: d.name,
    isDemo: d.isDemo,
    region: d.region,
    rank: k + 1,
    tier: TIERS[Math.min(3, Math.floor((k / NATIONAL_COUNT) * 4))],
  }),
);
export const nationalBoard = { epiYear: 2025, epiWeek: 22, asOf: '2025-06-01', computedAt: '2025-06-02T02:00:00.000Z', rows: nationalBoardRows };
