import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { demoDistrictFile } from './support/board-fixtures';
import { fakeApi, json, officerMe } from './support/fake-api';
import { renderRoutes, waitFor, type Rendered } from './support/render';

vi.mock('../../src/components/chart/echart', () => import('./support/echart-stub'));
vi.mock('../../src/components/chart/echart-base', () => import('./support/echart-stub'));

/** Issue 21 at 360 px: the District file's drivers stack, and district names on the Ladder break only between words. */
let view: Rendered | undefined;
afterEach(() => {
  view?.unmount();
  view = undefined;
  vi.restoreAllMocks();
});

function screenWidth(phone: boolean) {
  vi.spyOn(window, 'matchMedia').mockImplementation((query: string) => ({
    matches: phone ? query.includes('max-width') : query.includes('min-width'), media: query, onchange: null,
    addListener: () => {}, removeListener: () => {}, addEventListener: () => {}, removeEventListener: () => {}, dispatchEvent: () => false,
  }) as MediaQueryList);
}

const file = demoDistrictFile();
async function openFile() {
  fakeApi({
    'GET /api/me': () => json(200, officerMe),
    [`GET /api/districts/${file.district.id}/file`]: () => json(200, file),
  });
  view = await renderRoutes(`/districts/${file.district.id}`);
  const c = view.container;
  await waitFor(() => expect(c.querySelector('[data-driver]')).not.toBeNull(), 5000);
  return c;
}

describe('phone layouts', () => {
  it('when a District file opens on a phone, then each driver is a card of term–value rows, not a row of a five-column table', async () => {
    screenWidth(true);
    const c = await openFile();
    const stacked = c.querySelector('[data-testid="drivers-stacked"]')!;
    expect(stacked).not.toBeNull();
    const cards = [...stacked.querySelectorAll('li[data-driver]')];
    expect(cards.length).toBe(file.tiers.at(-1)!.drivers.length);
    for (const card of cards) {
      expect(card.querySelector('h4')?.textContent).toBeTruthy();
      const terms = [...card.querySelectorAll('dl.driver-figures > div > dt')].map((dt) => dt.textContent?.trim());
      expect(terms.slice(0, 3)).toEqual(['Score', 'Weight', 'Contribution'].map((w) => expect.stringContaining(w)));
    }
    // No drivers table on the phone.
    expect([...c.querySelectorAll('table caption')].some((cap) => cap.textContent === stacked.querySelector('h3')!.textContent)).toBe(false);
  });

  it('when the same file opens on a wide screen, then the drivers stay one table', async () => {
    screenWidth(false);
    const c = await openFile();
    expect(c.querySelector('[data-testid="drivers-stacked"]')).toBeNull();
    expect(c.querySelector('table tr[data-driver]')).not.toBeNull();
  });

  it('when the Ladder is narrow, then its district names wrap only between words: no width cap and no break inside a word', () => {
    const css = readFileSync(resolve(process.cwd(), 'src/features/ladder/ladder.css'), 'utf8');
    const phone = css.slice(css.indexOf('@media (max-width: 40rem)'));
    const nameRule = phone.slice(phone.indexOf('.ladder-table tbody th .link {'), phone.indexOf('}', phone.indexOf('.ladder-table tbody th .link {')));
    expect(nameRule).toContain('max-width: none');
    expect(nameRule).toContain('hyphens: manual');
    expect(nameRule).toContain('word-break: normal');
    // Nothing in the Ladder's styles lets a word break anywhere.
    expect(css).not.toMatch(/overflow-wrap:\s*anywhere|word-break:\s*break-all/);
  });
});
