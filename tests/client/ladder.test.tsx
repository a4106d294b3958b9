import { act } from 'react';
import { describe, expect, it, vi } from 'vitest';
import { MemoryRouter } from 'react-router-dom';
import { boardResponse, type LadderRow } from '../../shared/api/board.schema';
import { TIERS } from '../../shared/tier';
import { LadderTable, ladderCsv } from '../../src/features/ladder/components/ladder.table';
import { TIER_COLOURS, relativeLuminance } from '../../src/features/ladder/tier-scale';
import { neutraliseCell, toCsv } from '../../src/lib/csv';
import { demoBoard, demoBoardRows, demoBoundaries, ladderRow } from './support/board-fixtures';
import { fakeApi, json, officerMe } from './support/fake-api';
import { click, render, typeInto, waitFor, type Rendered, renderRoutes } from './support/render';

vi.mock('../../src/components/chart/echart', () => import('./support/echart-stub'));
vi.mock('../../src/components/chart/echart-base', () => import('./support/echart-stub'));
vi.mock('../../src/components/chart/echarts-core', () => ({ echarts: { registerMap: vi.fn() } }));

let view: Rendered | undefined;
const rows = boardResponse.parse(demoBoard).rows;

async function renderTable(data: LadderRow[]) {
  view = await render(
    <MemoryRouter>
      <LadderTable rows={data} caption="The Ladder" />
    </MemoryRouter>,
  );
  return view.container;
}

const districtOrder = (c: HTMLElement) => [...c.querySelectorAll('tbody tr[data-district]')].map((tr) => tr.getAttribute('data-district'));
const header = (c: HTMLElement, label: string) => {
  const th = [...c.querySelectorAll('thead th')].find((h) => h.querySelector('button')?.textContent?.startsWith(label));
  if (!th) throw new Error(`No column ${label}`);
  return th as HTMLTableCellElement;
};

describe('the Ladder table', () => {
  it('when it first shows, then the rows keep the server’s ranking and each tier carries its word and range', async () => {
    const c = await renderTable(rows);
    expect(districtOrder(c)).toEqual(['HV-01', 'HV-02', 'HV-03', 'HV-04']);
    const first = c.querySelector('tr[data-district="HV-01"]')!;
    expect(first.textContent).toContain('Critical');
    expect(first.textContent).toContain('range High–Critical');
    expect(first.textContent).toContain('up 1');
    expect(first.textContent).toContain('Case signal');
    expect(first.textContent).toContain('Above the channel');
    expect(c.querySelector('tr[data-district="HV-02"]')!.textContent).toContain('stale inputs');
    expect(c.querySelector('tr[data-district="HV-04"]')!.textContent).toContain('not enough data');
    expect(c.querySelector('tr[data-district="HV-03"]')!.textContent).toContain('new this week');
  });

  it('when a column header is clicked, then the rows sort by it and aria-sort says which way', async () => {
    const c = await renderTable(rows);
    const cases = header(c, 'Cases (last complete week)');
    expect(cases.getAttribute('aria-sort')).toBe('none');
    await click(cases.querySelector('button')!);
    expect(cases.getAttribute('aria-sort')).toBe('descending');
    expect(districtOrder(c)).toEqual(['HV-01', 'HV-03', 'HV-02', 'HV-04']);
    await click(cases.querySelector('button')!);
    expect(cases.getAttribute('aria-sort')).toBe('ascending');
    expect(districtOrder(c).slice(0, 3)).toEqual(['HV-02', 'HV-03', 'HV-01']);

    const district = header(c, 'District');
    await click(district.querySelector('button')!);
    expect(district.getAttribute('aria-sort')).toBe('ascending');
    expect(cases.getAttribute('aria-sort')).toBe('none');
    expect(districtOrder(c)).toEqual(['HV-03', 'HV-02', 'HV-04', 'HV-01']);
  });

  it('when text is typed into the filter, then only the districts whose name, code, tier or driver match remain', async () => {
    const c = await renderTable(rows);
    const filter = c.querySelector<HTMLInputElement>('input[type="search"]')!;
    await typeInto(filter, 'valley');
    expect(districtOrder(c)).toEqual(['HV-02']);
    expect(c.textContent).toContain('1 of 4 districts match');
    await typeInto(filter, 'critical');
    expect(districtOrder(c)).toEqual(['HV-01']);
    await typeInto(filter, 'larval');
    expect(districtOrder(c)).toEqual(['HV-03']);
    await typeInto(filter, 'nowhere at all');
    expect(c.textContent).toContain('No district matches the filter.');
    await typeInto(filter, '');
    expect(districtOrder(c)).toHaveLength(4);
  });

  it('when a column is unticked in the column chooser, then it leaves the table', async () => {
    const c = await renderTable(rows);
    const box = [...c.querySelectorAll('fieldset label')].find((l) => l.textContent === 'Leading driver')!.querySelector('input')!;
    expect(header(c, 'Leading driver')).toBeTruthy();
    await click(box);
    expect(() => header(c, 'Leading driver')).toThrow();
    expect(c.querySelector('tr[data-district="HV-01"]')!.textContent).not.toContain('Case signal');
  });

  it('when there are 5,000 districts, then only a window of rows is in the page and the scroll height is kept', async () => {
    const many = Array.from({ length: 5000 }, (_, i) => boardResponse.shape.rows.element.parse(ladderRow(i + 1, { rank: i + 1 })));
    const c = await renderTable(many);
    const rendered = c.querySelectorAll('tbody tr[data-district]').length;
    expect(rendered).toBeGreaterThan(5);
    expect(rendered).toBeLessThan(100);
    expect(c.querySelector('table')!.getAttribute('aria-rowcount')).toBe('5001');
    const spacer = c.querySelector<HTMLTableRowElement>('tbody tr.spacer-row')!;
    expect(parseInt(spacer.style.height, 10)).toBeGreaterThan(250_000);
  });
});

describe('the Ladder CSV', () => {
  it('when a cell starts with = + - @ a tab or a carriage return, then it is prefixed with a quote', () => {
    expect(neutraliseCell('=HYPERLINK("http://x")')).toBe('\'=HYPERLINK("http://x")');
    expect(neutraliseCell('+1')).toBe("'+1");
    expect(neutraliseCell('-2+3')).toBe("'-2+3");
    expect(neutraliseCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(neutraliseCell('\tx')).toBe("'\tx");
    expect(neutraliseCell('\rx')).toBe("'\rx");
    expect(neutraliseCell('Saltmarsh Coast')).toBe('Saltmarsh Coast');
    expect(neutraliseCell(-0.5)).toBe('-0.5');
    expect(toCsv(['a'], [['say "hi", then go']])).toBe('a\r\n"say ""hi"", then go"\r\n');
  });

  it('when the visible rows are exported, then a formula in a district name is neutralised and hidden columns are left out', async () => {
    const evil = boardResponse.shape.rows.element.parse(ladderRow(9, { name: '=cmd|\' /C calc\'!A0', code: 'HV-09' }));
    const c = await renderTable([...rows, evil]);
    await typeInto(c.querySelector<HTMLInputElement>('input[type="search"]')!, 'HV-09');

    let saved: Blob | undefined;
    vi.stubGlobal('URL', Object.assign(URL, { createObjectURL: (b: Blob) => ((saved = b), 'blob:ladder'), revokeObjectURL: () => {} }));
    const clicked = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => {});
    await click([...c.querySelectorAll('button')].find((b) => b.textContent === 'Export CSV')!);
    expect(clicked).toHaveBeenCalled();
    const text = (await saved!.text()).replace(/^\ufeff/, '');
    const lines = text.trim().split('\r\n');
    expect(lines[0]).toBe('Rank,District,Code,Tier,Score,Tier range,Confidence,Since last week,Leading driver,Cases (last complete week),Channel,Freshest weather');
    expect(lines).toHaveLength(2);
    expect(lines[1]).toContain("'=cmd|' /C calc'!A0");
    expect(lines[1]).not.toMatch(/,=cmd/);
    clicked.mockRestore();
  });

  it('when ladderCsv is given rows, then the tier column carries its word, score, range and confidence', () => {
    const csv = ladderCsv(
      rows.map((r) => ({ original: r }) as never),
      [{ id: 'district', columnDef: { meta: { label: 'District', csv: (r: LadderRow) => r.name } } }, { id: 'tier', columnDef: { meta: { label: 'Tier', csv: (r: LadderRow) => r.tier } } }],
    );
    expect(csv.split('\r\n')[1]).toBe('Saltmarsh Coast,HV-01,critical,0.81,High–Critical,ok');
    expect(csv.split('\r\n')[2]).toContain('stale inputs');
  });
});

describe('the tier colour scale', () => {
  it('when the four tier colours are turned to grayscale, then their relative luminances are distinct and fall from Baseline to Critical', () => {
    const lum = TIERS.map((t) => relativeLuminance(TIER_COLOURS[t]));
    expect(new Set(lum.map((l) => l.toFixed(3))).size).toBe(4);
    for (let i = 1; i < lum.length; i++) {
      expect(lum[i]).toBeLessThan(lum[i - 1]);
      // Neighbouring steps differ by a contrast of at least 1.5:1, so they stay apart in grayscale.
      expect((lum[i - 1] + 0.05) / (lum[i] + 0.05)).toBeGreaterThan(1.5);
    }
  });
});

describe('the Ladder screen', () => {
  it('when an officer opens the Ladder, then the ranking, the demo label, the cautions, the map’s district list and the Season runs item show', async () => {
    const fetch = fakeApi({
      'GET /api/me': () => json(200, officerMe),
      'GET /api/board': () => json(200, demoBoard),
      'GET /api/districts/boundaries': () => json(200, demoBoundaries),
    });
    const opened = await renderRoutes('/');
    view = opened;
    const router = opened.router;
    const c = view.container;
    await waitFor(() => expect(c.querySelector('tr[data-district="HV-01"]')).not.toBeNull());
    expect(c.querySelector('h1')?.textContent).toBe('Ladder');
    expect(c.textContent).toContain('week 22 of 2025');
    expect(c.textContent).toContain('Demo data — the Halvern Region is invented');
    expect(c.textContent).toContain('licensed clinician');
    const nav = c.querySelector('nav[aria-label="Main"]')!;
    expect([...nav.querySelectorAll('a')].map((a) => a.textContent)).toContain('Season runs');

    const list = await waitFor(() => {
      const ul = c.querySelector('ul[aria-label="Districts on the map"]');
      if (!ul) throw new Error('no map list yet');
      return ul;
    });
    const link = [...list.querySelectorAll('a')].find((a) => a.textContent?.includes('Orrin Valley'))!;
    expect(link.textContent).toContain('High');
    expect(link.textContent).toContain('stale inputs');
    await waitFor(() => expect(c.querySelector('[data-testid="echart-stub"]')).not.toBeNull(), 5000);
    expect(fetch.mock.calls.some(([u]) => String(u) === '/api/districts/boundaries')).toBe(true);

    fakeApi({ 'GET /api/me': () => json(200, officerMe) });
    await act(async () => link.click());
    // The District file route is lazy: the location changes once its module has loaded.
    await waitFor(() => expect(router.state.location.pathname).toBe(`/districts/${demoBoardRows[1].districtId}`), 5000);
  });
});
