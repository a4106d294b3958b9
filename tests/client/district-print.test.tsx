import { act } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { i18n, setLanguage } from '../../src/i18n';
import { CAUTIONS } from '../../src/features/cautions/cautions-panel';
import { demoDistrictFile } from './support/board-fixtures';
import { fakeApi, json, officerMe } from './support/fake-api';
import { click, getButton, waitFor, type Rendered, renderRoutes } from './support/render';

vi.mock('../../src/components/chart/echart', () => import('./support/echart-stub'));
vi.mock('../../src/components/chart/echart-base', () => import('./support/echart-stub'));

let view: Rendered | undefined;
afterEach(() => {
  vi.restoreAllMocks();
});

const file = demoDistrictFile();

async function open(url: string, me: typeof officerMe = officerMe) {
  fakeApi({
    'GET /api/me': () => json(200, me),
    [`GET /api/districts/${file.district.id}/file`]: () => json(200, file),
  });
  const opened = await renderRoutes(url);
  view = opened;
  const router = opened.router;
  return { c: view.container, router };
}

describe('the printable District file', () => {
  it('when it is opened, then it shows the tier and drivers, the key numbers, cases against the channel as a drawing and a table, the tier history and the cautions, without help buttons', async () => {
    const { c } = await open(`/districts/${file.district.id}/print`);
    await waitFor(() => expect(c.querySelector('h1')?.textContent).toContain('Saltmarsh Coast'), 5000);
    expect(c.querySelector('.print-page')).not.toBeNull();
    expect(c.textContent).toContain('Season 2025');
    expect(c.textContent).toContain('Demo data — the Halvern Region is invented');
    expect(c.textContent).toContain('Tier for week 22 of 2025');
    expect([...c.querySelectorAll('tr[data-driver]')].map((r) => r.querySelector('th')?.textContent)).toEqual(['Climate suitability', 'Vector clock', 'Larval indices', 'Case signal']);
    expect(c.textContent).toContain('The tier went up 1, from High to Critical');
    expect(c.querySelector('[data-key-number="degreeDays"]')?.textContent).toContain('285 °C·d');
    expect(c.querySelector('[data-key-number="cases"]')?.textContent).toContain('42');

    // Cases against the endemic channel: a static drawing with its accessible name, and the same numbers as a table.
    const svg = c.querySelector('svg[role="img"]')!;
    expect(svg.getAttribute('aria-label')).toContain('Weekly Dengue cases in 2025 as bars');
    expect(svg.querySelectorAll('rect').length).toBe(4);
    const rows = [...c.querySelectorAll('.print-section')[0].querySelectorAll('tbody tr')].map((r) => [...r.children].map((x) => x.textContent));
    expect(rows[3]).toEqual(['Week 22', '42', '3', '9', '18', 'Above the channel']);
    expect(c.textContent).toContain('Tier history by week');
    expect(c.textContent).toContain('Week 22, 2025');

    for (const line of CAUTIONS) expect(c.textContent).toContain(line);
    expect(c.querySelectorAll('button.help-button')).toHaveLength(0);
    // Issue 21: with no "?" buttons, the key numbers' lead does not tell the reader to select one; the tab is named.
    expect(c.querySelector('.key-numbers')?.textContent).not.toContain('Select');
    expect(document.title).toBe('Saltmarsh Coast · Printable District file · Broodcast');
    // No ECharts on this page.
    expect(c.querySelector('[data-testid="echart-stub"]')).toBeNull();
  });

  it('when the interface is in French, then the page title and the tier-history table are in French', async () => {
    try {
      const { c } = await open(`/districts/${file.district.id}/print`, { ...officerMe, preferences: { ...officerMe.preferences, language: 'fr' } });
      await waitFor(() => expect(c.querySelector('.print-page')).not.toBeNull(), 5000);
      await waitFor(() => expect(i18n.language).toBe('fr'));
      expect(document.title).toBe(`Saltmarsh Coast · ${i18n.t('district-file:print.title')} · Broodcast`);
      expect(document.title).not.toContain('Printable');
      expect(c.textContent).toContain(i18n.t('district-file:tierHistory.tableCaption'));
    } finally {
      view?.unmount();
      await act(() => setLanguage('en'));
    }
  });

  it('when Print is pressed, then the browser’s print dialog is asked for', async () => {
    const print = vi.fn();
    vi.stubGlobal('print', print);
    const { c } = await open(`/districts/${file.district.id}/print`);
    await waitFor(() => expect(c.querySelector('.print-page')).not.toBeNull(), 5000);
    await click(getButton(c, 'Print'));
    expect(print).toHaveBeenCalledTimes(1);
    expect(c.querySelector('.no-print')?.contains(getButton(c, 'Print'))).toBe(true);
  });

  it('when the District file is open, then it links to its printable page for the same season', async () => {
    const { c, router } = await open(`/districts/${file.district.id}`);
    await waitFor(() => expect(c.querySelector('h1')?.textContent).toBe('Saltmarsh Coast'), 5000);
    const link = c.querySelector<HTMLAnchorElement>('a[data-testid="print-link"]')!;
    expect(link.textContent).toBe('Printable page');
    expect(link.getAttribute('href')).toBe(`/districts/${file.district.id}/print?season=2025`);
    await click(link);
    await waitFor(() => expect(router.state.location.pathname).toBe(`/districts/${file.district.id}/print`), 5000);
    await waitFor(() => expect(c.querySelector('.print-page')).not.toBeNull(), 5000);
  });
});
