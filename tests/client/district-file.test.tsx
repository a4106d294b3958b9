import { describe, expect, it, vi } from 'vitest';
import { districtFileResponse } from '../../shared/api/board.schema';
import { CAUTIONS } from '../../src/features/cautions/cautions-panel';
import { generationDays, generationNamesFor, genStep } from '../../src/features/district-file/charts/vector-clock.charts';
import { demoDistrictFile } from './support/board-fixtures';
import { fakeApi, json, officerMe } from './support/fake-api';
import { click, selectOption, waitFor, type Rendered, renderRoutes } from './support/render';

vi.mock('../../src/components/chart/echart', () => import('./support/echart-stub'));
vi.mock('../../src/components/chart/echart-base', () => import('./support/echart-stub'));

let view: Rendered | undefined;
const file = demoDistrictFile();
const path = `/districts/${file.district.id}`;

async function open(url = path) {
  const seasons: (string | null)[] = [];
  const fetch = fakeApi({
    'GET /api/me': () => json(200, officerMe),
    [`GET /api/districts/${file.district.id}/file`]: () => json(200, file),
  });
  fetch.mockImplementation(async (input: string | URL | Request) => {
    const u = new URL(String(input), 'http://localhost');
    if (u.pathname === '/api/me') return json(200, officerMe);
    if (u.pathname === `/api/districts/${file.district.id}/file`) {
      seasons.push(u.searchParams.get('season'));
      const year = Number(u.searchParams.get('season') ?? 2025);
      return json(200, demoDistrictFile(year));
    }
    return json(404, { error: { code: 'not_found', message: 'not found' } });
  });
  const opened = await renderRoutes(url);
  view = opened;
  const router = opened.router;
  const c = view.container;
  await waitFor(() => expect(c.querySelector('h1')?.textContent).toBe('Saltmarsh Coast'), 5000);
  return { c, router, seasons };
}

describe('the District file', () => {
  it('when the fixture is read with the shared schema, then it is a valid answer', () => {
    expect(districtFileResponse.safeParse(file).success).toBe(true);
  });

  it('when an officer opens a District file, then the tier, its drivers with weights, contributions and data, the notes and the cautions show', async () => {
    const { c } = await open();
    expect(c.textContent).toContain('Demo data — the Halvern Region is invented');
    expect(c.textContent).toContain('Tier for week 22 of 2025');
    expect(c.textContent).toContain('Critical');
    expect(c.textContent).toContain('stale inputs');
    expect(c.textContent).toContain('range High to Critical');

    const drivers = [...c.querySelectorAll('tr[data-driver]')];
    expect(drivers.map((r) => r.querySelector('th')?.textContent)).toEqual(['Climate suitability', 'Vector clock', 'Larval indices', 'Case signal']);
    const cases = c.querySelector('tr[data-driver="cases"]')!;
    expect(cases.textContent).toContain('0.35'); // weight
    expect(cases.textContent).toContain('0.44'); // contribution
    expect(cases.textContent).toContain('Endemic channel zone');
    expect(cases.textContent).toContain('above the channel');
    expect(cases.textContent).toContain('Aberration test alarm');

    expect(c.textContent).toContain('What changed since last week');
    expect(c.textContent).toContain('The tier went up 1, from High to Critical');
    expect(c.textContent).toContain('Case signal moved it most: its contribution went from 0.35 to 0.44');
    expect(c.textContent).toContain('The newest weather is 5 days old.');

    for (const line of CAUTIONS) expect(c.textContent).toContain(line);
    expect(c.querySelector('a[href$="/cases"]')?.getAttribute('href')).toBe(`${path}/cases`);
  });

  it('when the charts are drawn, then each has a heading, a summary as its accessible name and a table behind a toggle', async () => {
    const { c } = await open();
    const figures = [...c.querySelectorAll('figure[data-chart]')];
    expect(figures.map((f) => f.getAttribute('data-chart'))).toEqual([
      'Daily temperature and humidity',
      'Heat accumulation — Aedes aegypti with dengue virus',
      'Vector clock — Aedes aegypti with dengue virus',
      'Relative vectorial capacity — Aedes aegypti with dengue virus',
      'Weekly cases against the endemic channel — Dengue',
      'Larval indices',
      'Tier history and its drivers',
    ]);
    for (const f of figures) {
      expect(f.querySelector('h3')?.textContent).toBeTruthy();
      expect(f.querySelector('[role="img"]')?.getAttribute('aria-label')?.length).toBeGreaterThan(30);
      expect(f.querySelector('[data-testid="echart-stub"]')).not.toBeNull();
    }
    const cases = figures[4];
    expect(cases.textContent).toContain('Week 22 had 42 cases above the channel');
    const toggle = [...cases.querySelectorAll('button')].find((b) => b.textContent === 'Show as table')!;
    expect(toggle.getAttribute('aria-expanded')).toBe('false');
    await click(toggle);
    expect(toggle.getAttribute('aria-expanded')).toBe('true');
    const rows = [...cases.querySelectorAll('tbody tr')].map((r) => [...r.children].map((x) => x.textContent));
    expect(rows[3]).toEqual(['Week 22', '42', '3', '9', '18', '9']);
  });

  it('when some of a week’s surveys did not count pupae, then the pupa index says how many surveys it rests on, and a week with none shows a dash', async () => {
    const { c } = await open();
    const larval = [...c.querySelectorAll('figure[data-chart]')].find((f) => f.getAttribute('data-chart') === 'Larval indices')!;
    await click([...larval.querySelectorAll('button')].find((b) => b.textContent === 'Show as table')!);
    const header = [...larval.querySelectorAll('thead th')].map((x) => x.textContent);
    expect(header[header.length - 1]).toBe('Pupa index (pupae per 100 houses)');
    const rows = [...larval.querySelectorAll('tbody tr')].map((r) => [...r.children].map((x) => x.textContent));
    expect(rows[0][rows[0].length - 1]).toBe('0.4 (pupae counted in 2 of 3 surveys)');
    expect(rows[1][rows[1].length - 1]).toBe('—');
  });

  it('when another season is chosen, then the file of that season is fetched', async () => {
    const { c, router, seasons } = await open();
    expect(seasons).toEqual([null]);
    const select = [...c.querySelectorAll('select')][0] as HTMLSelectElement;
    expect([...select.options].map((o) => o.value)).toEqual(['2025', '2024', '2023']);
    await selectOption(select, '2024');
    await waitFor(() => expect(seasons).toContain('2024'));
    expect(router.state.location.search).toBe('?season=2024');
    await waitFor(() => expect(c.textContent).toContain('Tier for week 22 of 2024'));
  });

  it('when a season has no weather (no heat line) and another is compared, then the profile is still named and the page says why no line is drawn', async () => {
    // Issue 21: "Compare heat with 2023" drew nothing and said nothing; an earlier season claimed "no profile".
    const fetch = fakeApi({});
    fetch.mockImplementation(async (input: string | URL | Request) => {
      const u = new URL(String(input), 'http://localhost');
      if (u.pathname === '/api/me') return json(200, officerMe);
      if (u.pathname === `/api/districts/${file.district.id}/file`) {
        const year = Number(u.searchParams.get('season') ?? 2025);
        const f = demoDistrictFile(year);
        return json(200, year === 2025 ? f : { ...f, vectorClock: [] });
      }
      return json(404, { error: { code: 'not_found', message: 'not found' } });
    });
    view = await renderRoutes(`${path}?compare=2023`);
    const c = view.container;
    await waitFor(() => expect(c.querySelector('[data-testid="compare-note"]')?.textContent).toBe(
      'No dashed line for 2023: no weather is stored for that season in this district, so there is no heat accumulation to compare.'), 5000);

    view.unmount();
    view = await renderRoutes(`${path}?season=2024`);
    const c2 = view.container;
    await waitFor(() => expect(c2.textContent).toContain('No heat accumulation for 2024: no weather is stored for that season.'), 5000);
    expect(c2.textContent).not.toContain('No vector–pathogen profile is assigned');
    expect(c2.textContent).toContain('Profiles: Aedes aegypti with dengue virus.');
  });

  it('when the EIP is not completed on the last days (too cool for the pathogen), then the vector clock and the key numbers say so in words, not as a number of days', async () => {
    const cool = demoDistrictFile();
    const vc: { eipDays: (number | null)[]; survivalThroughEip: (number | null)[] } = cool.vectorClock[0];
    // Model output for such days: no EIP (null) while the traits are known (survival through it is 0).
    vc.eipDays = vc.eipDays.map((d, i) => (i >= 14 ? null : d));
    vc.survivalThroughEip = vc.survivalThroughEip.map((x, i) => (i >= 14 ? 0 : x));
    const fetch = fakeApi({});
    fetch.mockImplementation(async (input: string | URL | Request) => {
      const u = new URL(String(input), 'http://localhost');
      if (u.pathname === '/api/me') return json(200, officerMe);
      if (u.pathname === `/api/districts/${file.district.id}/file`) return json(200, cool);
      return json(404, { error: { code: 'not_found', message: 'not found' } });
    });
    view = await renderRoutes(path);
    const c = view.container;
    await waitFor(() => expect(c.querySelector('h1')?.textContent).toBe('Saltmarsh Coast'), 5000);
    const figure = c.querySelector('figure[data-chart="Vector clock — Aedes aegypti with dengue virus"]')!;
    expect(figure.querySelector('[role="img"]')?.getAttribute('aria-label')).toContain('the extrinsic incubation was not completed');
    await click([...figure.querySelectorAll('button')].find((b) => b.textContent === 'Show as table')!);
    const rows = [...figure.querySelectorAll('tbody tr')].map((r) => [...r.children].map((x) => x.textContent));
    expect(rows[0][1]).toBe('9.5');
    expect(rows[rows.length - 1][1]).toBe('not completed');
    expect(c.textContent).toMatch(/Extrinsic incubation period\s*not completed/);
  });

  it('when a season has many generations, then only every n-th is named so the names fit the chart’s width', () => {
    // Issue 21: "gen 1 … gen 34" piled up. 34 generations on a 1280 px screen: every 5th (6 names); on a phone: every 20th.
    expect(generationNamesFor(1152 - 96)).toBe(8);
    expect(generationNamesFor(360 - 96)).toBe(3);
    expect(genStep(34, generationNamesFor(1056))).toBe(5);
    expect(genStep(34, generationNamesFor(264))).toBe(20);
    expect(Math.floor(34 / genStep(34, 8))).toBeLessThanOrEqual(8);
    expect(genStep(6, 8)).toBe(1);
  });

  it('when the low, central and high vectorial capacity agree to two decimals, then one value is shown, not a "low 0.27 – high 0.27" range', async () => {
    const flat = demoDistrictFile();
    const vc = flat.vectorClock[0] as { rvc: (number | null)[]; rvcLow: (number | null)[]; rvcHigh: (number | null)[] };
    vc.rvc = vc.rvc.map(() => 0.271);
    vc.rvcLow = vc.rvcLow.map(() => 0.2705);
    vc.rvcHigh = vc.rvcHigh.map(() => 0.2714);
    const fetch = fakeApi({});
    fetch.mockImplementation(async (input: string | URL | Request) => {
      const u = new URL(String(input), 'http://localhost');
      if (u.pathname === '/api/me') return json(200, officerMe);
      if (u.pathname === `/api/districts/${file.district.id}/file`) return json(200, flat);
      return json(404, { error: { code: 'not_found', message: 'not found' } });
    });
    view = await renderRoutes(path);
    const c = view.container;
    await waitFor(() => expect(c.querySelector('h1')?.textContent).toBe('Saltmarsh Coast'), 5000);
    expect(c.textContent).toContain('0.27');
    expect(c.textContent).not.toMatch(/low 0\.27\s*–\s*high 0\.27/);
    const summaries = [...c.querySelectorAll('[role="img"]')].map((e) => e.getAttribute('aria-label')).join(' ');
    expect(summaries).not.toMatch(/low estimate of 0\.27 and a high of 0\.27/);
    expect(summaries).toContain('the low and high estimates give the same value');
  });

  it('when the generations pass a whole number, then that day is a generation mark', () => {
    expect(generationDays({ dates: ['d1', 'd2', 'd3', 'd4'], generations: [0.4, 1.1, null, 2.0] })).toEqual([
      { date: 'd2', generation: 1 },
      { date: 'd4', generation: 2 },
    ]);
  });
});
