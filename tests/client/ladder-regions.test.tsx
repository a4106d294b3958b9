import { act } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { boardResponse } from '../../shared/api/board.schema';
import { groupByRegion, rowsInRegionOrder, rowsOfRegion } from '../../src/features/ladder/region-groups';
import { demoBoard, demoBoundaries, ladderRow } from './support/board-fixtures';
import { fakeApi, json, officerMe } from './support/fake-api';
import { click, renderRoutes, selectOption, waitFor, type Rendered } from './support/render';

vi.mock('../../src/components/chart/echart', () => import('./support/echart-stub'));
vi.mock('../../src/components/chart/echarts-core', () => ({ echarts: { registerMap: vi.fn() } }));

/** Issue 17: the Ladder filters and groups by region and sums each region up. */
const north = { id: '00000000-0000-4000-8000-00000000a001', code: 'N', name: 'Northmoor' };
const south = { id: '00000000-0000-4000-8000-00000000a002', code: 'S', name: 'Southfen' };
const board = {
  ...demoBoard,
  rows: [
    ladderRow(1, { code: 'HV-01', name: 'Saltmarsh Coast', tier: 'critical', tierLow: 'critical', tierHigh: 'critical', score: 0.8, tierChange: 2, scoreChange: 0.3, region: south }),
    ladderRow(2, { code: 'HV-02', name: 'Orrin Valley', rank: 2, tier: 'high', tierLow: 'high', tierHigh: 'high', score: 0.6, tierChange: 1, scoreChange: 0.1, region: north }),
    ladderRow(3, { code: 'HV-03', name: 'Korrin Bay', rank: 3, tier: 'raised', tierLow: 'raised', tierHigh: 'raised', score: 0.3, tierChange: -1, scoreChange: -0.2, region: south }),
    ladderRow(4, { code: 'HV-04', name: 'Pellam Highlands', rank: 4, score: 0.05, tierChange: 0, scoreChange: 0, confidence: 'insufficient', region: north }),
    ladderRow(5, { code: 'HV-05', name: 'Vell Marsh', rank: 5, score: 0.04, tierChange: 0, scoreChange: 0.01, region: null }),
  ],
};
const rows = boardResponse.parse(board).rows;

let view: Rendered | undefined;
afterEach(() => {
  view?.unmount();
  view = undefined;
  vi.restoreAllMocks();
});

const order = (c: HTMLElement) => [...c.querySelectorAll('tbody tr[data-district]')].map((tr) => tr.getAttribute('data-district'));

async function openLadder(me: object = officerMe) {
  fakeApi({
    'GET /api/me': () => json(200, me),
    'GET /api/board': () => json(200, board),
    'GET /api/districts/boundaries': () => json(200, demoBoundaries),
  });
  view = await renderRoutes('/');
  const c = view.container;
  await waitFor(() => expect(c.querySelector('tr[data-district="HV-01"]')).not.toBeNull(), 3000);
  return c;
}

describe('the Ladder by region', () => {
  it('when the board answers, then each row carries its region through the shared contract', () => {
    expect(rows[0].region).toEqual(south);
    expect(rows[4].region).toBeNull();
    expect(() => boardResponse.parse({ ...board, rows: [{ ...board.rows[0], region: { id: 'x', code: 'N' } }] })).toThrow();
  });

  it('when rows are grouped, then named regions come by name, districts in no region last, and each region counts its tiers and largest changes', () => {
    const groups = groupByRegion(rows, 'en');
    expect(groups.map((g) => g.name)).toEqual(['Northmoor', 'Southfen', null]);
    const southGroup = groups[1];
    expect(southGroup.districts).toBe(2);
    expect(southGroup.perTier).toEqual({ baseline: 0, raised: 1, high: 0, critical: 1 });
    expect(southGroup.up).toBe(1);
    expect(southGroup.down).toBe(1);
    expect(southGroup.largestChanges.map((r) => r.code)).toEqual(['HV-01', 'HV-03']);
    // A district without a tier is counted apart, not as Baseline.
    expect(groups[0].noTier).toBe(1);
    expect(groups[0].perTier.baseline).toBe(0);
    expect(rowsInRegionOrder(rows, 'en').map((r) => r.code)).toEqual(['HV-02', 'HV-04', 'HV-01', 'HV-03', 'HV-05']);
    expect(rowsOfRegion(rows, 'none').map((r) => r.code)).toEqual(['HV-05']);
    expect(rowsOfRegion(rows, 'mine', [north.id]).map((r) => r.code)).toEqual(['HV-02', 'HV-04']);
  });

  it('when a region is chosen on the Ladder, then only its districts show, the summary follows, and grouping orders rows by region', async () => {
    const c = await openLadder();
    const summary = c.querySelector('[data-testid="region-summary"]')!;
    expect(summary.textContent).toContain('Regions this week');
    expect([...summary.querySelectorAll('tbody tr')].map((tr) => tr.querySelector('th')!.textContent)).toEqual(['Northmoor', 'Southfen', 'No region']);
    expect(summary.querySelector('tr[data-region="S"]')!.textContent).toContain('Saltmarsh Coast');
    expect(summary.querySelector('tr[data-region="S"]')!.textContent).toContain('1 up · 1 down');
    // The region column shows on a wide screen.
    expect(c.querySelector('tr[data-district="HV-01"]')!.textContent).toContain('Southfen');

    const select = [...c.querySelectorAll('select')].find((s) => s.labels?.[0]?.textContent === 'Region') as HTMLSelectElement;
    await selectOption(select, north.id);
    await waitFor(() => expect(order(c)).toEqual(['HV-02', 'HV-04']));
    expect([...c.querySelectorAll('[data-testid="region-summary"] tbody tr')]).toHaveLength(1);

    await selectOption(select, 'all');
    const group = [...c.querySelectorAll('label')].find((l) => l.textContent === 'Group by region')!.querySelector('input')!;
    await click(group);
    await waitFor(() => expect(order(c)).toEqual(['HV-02', 'HV-04', 'HV-01', 'HV-03', 'HV-05']));

    // A region's name in the summary filters the Ladder to it.
    const southButton = [...c.querySelectorAll('[data-testid="region-summary"] button')].find((b) => b.textContent === 'Southfen') as HTMLButtonElement;
    await act(async () => southButton.click());
    await waitFor(() => expect(order(c)).toEqual(['HV-01', 'HV-03']));
  });

  it('when the person is scoped to a region, then the Ladder opens on their regions', async () => {
    const c = await openLadder({ ...officerMe, regions: [south] });
    await waitFor(() => expect(order(c)).toEqual(['HV-01', 'HV-03']));
    const select = [...c.querySelectorAll('select')].find((s) => s.labels?.[0]?.textContent === 'Region') as HTMLSelectElement;
    expect(select.value).toBe('mine');
  });

  it('when the screen is a phone, then the region filter still shows and the region column waits in the column chooser', async () => {
    vi.spyOn(window, 'matchMedia').mockImplementation((query: string) => ({
      matches: query.includes('max-width'), media: query, onchange: null,
      addListener: () => {}, removeListener: () => {}, addEventListener: () => {}, removeEventListener: () => {}, dispatchEvent: () => false,
    }) as MediaQueryList);
    const c = await openLadder();
    const headers = [...c.querySelectorAll('table.ladder-table thead th')].map((th) => th.textContent);
    expect(headers).toHaveLength(4);
    expect([...c.querySelectorAll('select')].some((s) => s.labels?.[0]?.textContent === 'Region')).toBe(true);
    const chooser = [...c.querySelectorAll('.column-chooser label')].find((l) => l.textContent === 'Region')!.querySelector('input')!;
    expect(chooser.checked).toBe(false);
  });
});
